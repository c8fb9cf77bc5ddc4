// What the fix applies to: machines and chassis families, picked from the catalogue and shown as removable chips.
import { CatalogueTypeahead, type LookupHit } from './CatalogueTypeahead';
import type { LabelledRefData } from '../../lib/writing/editor-data';

interface AppliesToProps {
  machines: LabelledRefData[];
  chassis: LabelledRefData[];
  onChange: (next: { machines: LabelledRefData[]; chassis: LabelledRefData[] }) => void;
  error?: string | undefined;
}

function Chips({ title, items, onRemove }: { title: string; items: LabelledRefData[]; onRemove: (id: number) => void }) {
  if (items.length === 0) return null;
  return (
    <div>
      <p className="font-sans text-sm text-ink-soft">{title}</p>
      <ul className="mt-1 flex flex-wrap gap-2" role="list">
        {items.map((item) => (
          <li key={item.id} className="flex items-center gap-1 rounded bg-teal-wash px-2 py-1 font-sans text-sm">
            <span>{item.label}</span>
            <button type="button" className="px-1 text-teal" aria-label={`Remove ${item.label}`} onClick={() => onRemove(item.id)}>
              ×
            </button>
          </li>
        ))}
      </ul>
    </div>
  );
}

export function AppliesTo({ machines, chassis, onChange, error }: AppliesToProps) {
  const pick = (hit: LookupHit) => {
    const ref = { id: hit.id, slug: hit.slug, label: hit.label };
    if (hit.kind === 'machine') onChange({ machines: [...machines, ref], chassis });
    else onChange({ machines, chassis: [...chassis, ref] });
  };
  const exclude = (hit: LookupHit) => (hit.kind === 'machine' ? machines : chassis).some((r) => r.id === hit.id);
  return (
    <fieldset id="field-machineIds" className="grid gap-2" aria-invalid={error ? true : undefined}>
      <legend className="font-sans font-semibold">Applies to</legend>
      <Chips title="Machines" items={machines} onRemove={(id) => onChange({ machines: machines.filter((m) => m.id !== id), chassis })} />
      <Chips
        title="Chassis families"
        items={chassis}
        onRemove={(id) => onChange({ machines, chassis: chassis.filter((c) => c.id !== id) })}
      />
      <CatalogueTypeahead label="Add a machine or chassis family" onPick={pick} exclude={exclude} />
      <p className="font-sans text-sm text-brick empty:hidden" role={error ? 'alert' : undefined}>
        {error}
      </p>
    </fieldset>
  );
}

// The fix's cautions: one per kind of hazard, each with what this fix asks the reader to watch for.
import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { cautionKinds, cautionLabels, type CautionKind } from '@/lib/schemas/revision-values';

interface CautionsEditorProps {
  control: Control<FixDraftInput>;
  register: UseFormRegister<FixDraftInput>;
  errors: FieldErrors<FixDraftInput>;
}

export function CautionsEditor({ control, register, errors }: CautionsEditorProps) {
  const { fields, append, remove } = useFieldArray({ control, name: 'cautions' });
  const current = useWatch({ control, name: 'cautions' }) ?? [];
  const unused = cautionKinds.filter((k) => !current.some((c) => c.kind === k));
  const message = errors.cautions?.message ?? errors.cautions?.root?.message;
  return (
    <fieldset id="field-cautions" className="grid gap-3">
      <legend className="font-sans font-semibold">Cautions</legend>
      <p className="font-sans text-sm text-ink-soft">
        Add one for every hazard of this repair: mains, stored charge, lasers, heat, sharp edges, springs. Readers see them before the
        remedy, with a reminder to follow local electrical codes and licensed practice.
      </p>
      {fields.map((field, i) => (
        <div key={field.id} className="caution grid gap-2 p-3">
          <label className="font-sans text-sm font-semibold" htmlFor={`caution-${i}-kind`}>
            Hazard
          </label>
          <select id={`caution-${i}-kind`} className="input" {...register(`cautions.${i}.kind`)}>
            {cautionKinds.map((k) => (
              <option key={k} value={k}>
                {cautionLabels[k]}
              </option>
            ))}
          </select>
          <label className="font-sans text-sm font-semibold" htmlFor={`caution-${i}-detail`}>
            What to watch for in this fix
          </label>
          <textarea id={`caution-${i}-detail`} className="input" rows={2} maxLength={600} {...register(`cautions.${i}.detail`)} />
          <div>
            <button type="button" className="btn-quiet" onClick={() => remove(i)}>
              Remove this caution
            </button>
          </div>
        </div>
      ))}
      <p className="font-sans text-sm text-brick empty:hidden" role={message ? 'alert' : undefined}>
        {message}
      </p>
      <div>
        <button
          type="button"
          className="btn-quiet"
          disabled={unused.length === 0}
          onClick={() => append({ kind: unused[0] as CautionKind, detail: '' })}
        >
          Add a caution
        </button>
      </div>
    </fieldset>
  );
}

// The parts list as a table: ref, kind, value, rating, quantity, notes; each value read by the value decoder as typed.
import { useEffect, useState } from 'react';
import { useFieldArray, useWatch, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { emptyPartRow, fixDraftLimits } from '@/lib/schemas/fix-draft-values';
import { partKinds, type PartKind } from '@/lib/schemas/revision-values';

interface PartsEditorProps {
  control: Control<FixDraftInput>;
  register: UseFormRegister<FixDraftInput>;
  errors: FieldErrors<FixDraftInput>;
}

const kindLabel = (k: PartKind) => k.replace(/_/g, ' ');

type DescribePart = (typeof import('@/lib/values'))['describePart'];
let describeLoaded: DescribePart | null = null;

/** The value decoder, loaded after the form has painted (the rows read "Reads as …" once it is here). */
function useDescribePart(): DescribePart | null {
  const [describe, setDescribe] = useState<DescribePart | null>(() => describeLoaded);
  useEffect(() => {
    if (describe) return;
    void import('@/lib/values').then((values) => {
      describeLoaded = values.describePart;
      setDescribe(() => values.describePart);
    });
  }, [describe]);
  return describe;
}

/** What the decoder makes of a value as typed: its canonical label, or its message with an example. */
function decoded(describePart: DescribePart | null, value: string, rating: string, kind: PartKind): { ok: boolean; text: string } | null {
  if (value.trim() === '' || !describePart) return null;
  const result = describePart(value, rating, { kind });
  return result.ok
    ? { ok: true, text: `Reads as ${result.value.label}` }
    : { ok: false, text: `${result.error.message} For example: ${result.error.example}` };
}

export function PartsEditor({ control, register, errors }: PartsEditorProps) {
  const { fields, append, remove, move } = useFieldArray({ control, name: 'parts' });
  const rows = useWatch({ control, name: 'parts' }) ?? [];
  const describePart = useDescribePart();
  return (
    // Positioned, so the visually hidden header text stays inside the scrolling box instead of widening a phone's page.
    <div id="field-parts" className="relative overflow-x-auto">
      <table className="w-full border-collapse font-sans text-sm">
        <caption className="text-left font-semibold">Parts list</caption>
        <thead>
          <tr className="bg-paper-deep text-left">
            <th scope="col" className="px-2 py-1">
              Ref.
            </th>
            <th scope="col" className="px-2 py-1">
              Kind
            </th>
            <th scope="col" className="px-2 py-1">
              Value
            </th>
            <th scope="col" className="px-2 py-1">
              Rating
            </th>
            <th scope="col" className="px-2 py-1">
              Qty
            </th>
            <th scope="col" className="px-2 py-1">
              Notes
            </th>
            <th scope="col" className="px-2 py-1">
              <span className="sr-only">Row actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {fields.map((field, i) => {
            const row = rows[i] ?? field;
            const check = decoded(describePart, row.value ?? '', row.rating ?? '', row.kind);
            const serverError = errors.parts?.[i]?.value?.message;
            const quantityError = errors.parts?.[i]?.quantity?.message;
            const n = i + 1;
            return (
              <tr key={field.id} className="border-b border-rule align-top">
                <td className="px-1 py-1">
                  <input
                    aria-label={`Reference of part ${n}`}
                    className="input w-20 font-mono"
                    maxLength={40}
                    {...register(`parts.${i}.ref`)}
                  />
                </td>
                <td className="px-1 py-1">
                  <select aria-label={`Kind of part ${n}`} className="input" {...register(`parts.${i}.kind`)}>
                    {partKinds.map((k) => (
                      <option key={k} value={k}>
                        {kindLabel(k)}
                      </option>
                    ))}
                  </select>
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Value of part ${n}`}
                    aria-describedby={`part-${i}-check`}
                    aria-invalid={check?.ok === false || serverError ? true : undefined}
                    className="input w-32 font-mono"
                    maxLength={120}
                    {...register(`parts.${i}.value`)}
                  />
                  <p
                    id={`part-${i}-check`}
                    className={`mt-1 max-w-xs ${check?.ok === false || serverError ? 'text-brick' : 'text-ink-soft'} empty:hidden`}
                  >
                    {serverError ?? check?.text}
                  </p>
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Rating of part ${n}`}
                    className="input w-32 font-mono"
                    maxLength={120}
                    {...register(`parts.${i}.rating`)}
                  />
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Quantity of part ${n}`}
                    aria-describedby={`part-${i}-quantity-error`}
                    aria-invalid={quantityError ? true : undefined}
                    type="number"
                    min={1}
                    max={999}
                    className="input w-16"
                    {...register(`parts.${i}.quantity`, { valueAsNumber: true })}
                  />
                  <p id={`part-${i}-quantity-error`} className="mt-1 max-w-[10rem] text-brick empty:hidden">
                    {quantityError}
                  </p>
                </td>
                <td className="px-1 py-1">
                  <input aria-label={`Notes on part ${n}`} className="input w-40" maxLength={500} {...register(`parts.${i}.notes`)} />
                </td>
                <td className="whitespace-nowrap px-1 py-1">
                  <button
                    type="button"
                    className="btn-quiet"
                    aria-label={`Move part ${n} up`}
                    disabled={i === 0}
                    onClick={() => move(i, i - 1)}
                  >
                    ↑
                  </button>
                  <button type="button" className="btn-quiet" aria-label={`Remove part ${n}`} onClick={() => remove(i)}>
                    Remove
                  </button>
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
      <button
        type="button"
        className="btn-quiet mt-2"
        disabled={fields.length >= fixDraftLimits.parts}
        onClick={() => append(emptyPartRow())}
      >
        Add a part
      </button>
    </div>
  );
}

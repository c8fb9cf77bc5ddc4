// The readings table: where to measure, what a good unit shows, what a faulty one typically shows, a note.
import { useFieldArray, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { FixDraftInput } from '@/lib/schemas/fix-draft';
import { fixDraftLimits } from '@/lib/schemas/fix-draft-values';

interface ReadingsEditorProps {
  control: Control<FixDraftInput>;
  register: UseFormRegister<FixDraftInput>;
  errors: FieldErrors<FixDraftInput>;
}

export function ReadingsEditor({ control, register, errors }: ReadingsEditorProps) {
  const { fields, append, remove } = useFieldArray({ control, name: 'readings' });
  return (
    // Positioned, so the visually hidden header text stays inside the scrolling box instead of widening a phone's page.
    <div id="field-readings" className="relative overflow-x-auto">
      <table className="w-full border-collapse font-sans text-sm">
        <caption className="text-left font-semibold">Readings</caption>
        <thead>
          <tr className="bg-paper-deep text-left">
            <th scope="col" className="px-2 py-1">
              Test point
            </th>
            <th scope="col" className="px-2 py-1">
              Expected
            </th>
            <th scope="col" className="px-2 py-1">
              Typical faulty reading
            </th>
            <th scope="col" className="px-2 py-1">
              Note
            </th>
            <th scope="col" className="px-2 py-1">
              <span className="sr-only">Row actions</span>
            </th>
          </tr>
        </thead>
        <tbody>
          {fields.map((field, i) => {
            const rowErrors = errors.readings?.[i];
            const message = rowErrors?.testPoint?.message ?? rowErrors?.expected?.message;
            return (
              <tr key={field.id} className="border-b border-rule align-top">
                <td className="px-1 py-1">
                  <input
                    aria-label={`Test point of reading ${i + 1}`}
                    aria-invalid={rowErrors?.testPoint ? true : undefined}
                    className="input w-40 font-mono"
                    maxLength={120}
                    {...register(`readings.${i}.testPoint`)}
                  />
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Expected value of reading ${i + 1}`}
                    aria-invalid={rowErrors?.expected ? true : undefined}
                    aria-describedby={`reading-${i}-error`}
                    className="input w-28 font-mono"
                    maxLength={80}
                    {...register(`readings.${i}.expected`)}
                  />
                  <p id={`reading-${i}-error`} className="mt-1 text-brick empty:hidden">
                    {message}
                  </p>
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Typical faulty reading ${i + 1}`}
                    className="input w-28 font-mono"
                    maxLength={80}
                    {...register(`readings.${i}.measured`)}
                  />
                </td>
                <td className="px-1 py-1">
                  <input
                    aria-label={`Note on reading ${i + 1}`}
                    className="input w-48"
                    maxLength={300}
                    {...register(`readings.${i}.note`)}
                  />
                </td>
                <td className="px-1 py-1">
                  <button type="button" className="btn-quiet" aria-label={`Remove reading ${i + 1}`} onClick={() => remove(i)}>
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
        disabled={fields.length >= fixDraftLimits.readings}
        onClick={() => append({ testPoint: '', expected: '', measured: '', note: '' })}
      >
        Add a reading
      </button>
    </div>
  );
}

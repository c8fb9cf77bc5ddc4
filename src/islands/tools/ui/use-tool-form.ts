// State of a tool's form: fields as typed, the outcome recomputed on every keystroke, the address kept in step.
import { useEffect, useMemo, useRef, useState, type SubmitEvent } from 'react';
import { queryFromFields, type Outcome } from '../../../lib/tools/form-reader';

export interface ToolForm<F extends string, R> {
  fields: Record<F, string>;
  outcome: Outcome<F, R>;
  setField: (name: F, value: string) => void;
  setFields: (fields: Record<F, string>) => void;
  onSubmit: (event: SubmitEvent<HTMLFormElement>) => void;
}

export function useToolForm<F extends string, R>(
  path: string,
  initialFields: Record<F, string>,
  initialSubmitted: boolean,
  compute: (fields: Readonly<Record<F, string>>, submitted: boolean) => Outcome<F, R>,
): ToolForm<F, R> {
  const [fields, setFields] = useState<Record<F, string>>(initialFields);
  const [submitted, setSubmitted] = useState<boolean>(initialSubmitted);
  const outcome = useMemo(() => compute(fields, submitted), [compute, fields, submitted]);
  const firstRender = useRef(true);

  // The address follows the fields, so a printed or shared page shows (and recomputes) the same result.
  useEffect(() => {
    if (firstRender.current) {
      firstRender.current = false;
      return;
    }
    const query = queryFromFields(fields);
    window.history.replaceState(window.history.state, '', query === '' ? path : `${path}?${query}`);
  }, [fields, path]);

  return {
    fields,
    outcome,
    setField: (name, value) => setFields((current) => ({ ...current, [name]: value })),
    setFields: (next) => setFields(next),
    onSubmit: (event) => {
      // With JavaScript the result is already on the page; the button then only shows what is missing.
      event.preventDefault();
      setSubmitted(true);
    },
  };
}

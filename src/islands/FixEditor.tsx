// The writing island: structured fields, the remedy editor, parts and photos, with autosave and submission.
import '@/lib/schemas/zod-in-browser';
import { useState } from 'react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { FixForm } from './editor/FixForm';
import type { FixEditorProps } from '../lib/writing/editor-data';

export default function FixEditor(props: FixEditorProps) {
  const [client] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1, refetchOnWindowFocus: false } } }));
  return (
    <QueryClientProvider client={client}>
      <FixForm {...props} />
    </QueryClientProvider>
  );
}

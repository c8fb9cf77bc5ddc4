// The check a submission must pass in the browser: the server's own zod schema, with readable messages.
// Loaded after the form has painted (see later.ts).
import '@/lib/schemas/zod-in-browser';
import { zodResolver } from '@hookform/resolvers/zod';
import { fixSubmissionSchema } from '@/lib/schemas/fix-draft';
import { readableErrors } from '@/lib/schemas/field-errors';

export const submissionResolver = zodResolver(fixSubmissionSchema, readableErrors);

// The writing page's heavy parts, loaded after the form has painted: the Tiptap remedy editor, the submission
// check (zod) and the stale-base comparison. The form shows at once; these arrive while the writer reads it.
import { lazy } from 'react';
import type { Editor } from '@tiptap/react';
import type { Resolver } from 'react-hook-form';
import type { FixDraft, FixDraftInput } from '@/lib/schemas/fix-draft';
import type { PhotoRefData } from '../../lib/writing/editor-data';

const bodyEditorModule = () => import('./BodyEditor');
const submissionCheckModule = () => import('./submission-check');

export const LazyBodyEditor = lazy(() => bodyEditorModule().then((m) => ({ default: m.BodyEditor })));
export const LazyStaleBasePanel = lazy(() => import('./StaleBasePanel').then((m) => ({ default: m.StaleBasePanel })));

/** Starts loading the editor and the submission check as soon as the form is on screen. */
export function preloadLaterParts(): void {
  void bodyEditorModule();
  void submissionCheckModule();
}

/** The submission check, loaded on first use (normally already preloaded). */
export const submissionResolver: Resolver<FixDraftInput, unknown, FixDraft> = async (values, context, options) =>
  (await submissionCheckModule()).submissionResolver(values, context, options);

/** Puts a photo into the remedy; the editor exists, so its module (with the figure command) has loaded. */
export function insertFigureLater(editor: Editor, photo: PhotoRefData): void {
  void import('./body-panels').then((m) => m.insertFigure(editor, photo));
}

// Tells an author what became of their revision (proofed, returned with a note, amended by a moderator).
import { config } from '../core/config';
import { escapeHtml } from '../render/escape';
import type { OutgoingMail } from '../mail/send';
import { enqueueMail } from '../mail/outbox';
import { db } from '../core/db';
import { authorEmailOf } from '../writing/revisions';

export type ProofingOutcome = 'proofed' | 'returned' | 'amended';

export interface AuthorNotice {
  to: string;
  authorName: string;
  outcome: ProofingOutcome;
  fixTitle: string;
  revisionNumber: number;
  /** The proofer's note: required when returned, optional otherwise. */
  note: string | null;
  /** Absolute path on this site: the live fix when proofed, the writer's revisions otherwise. */
  path: string;
  /** The moderator's revision that replaced this one, when amended. */
  amendedInto?: number;
}

const subjects: Record<ProofingOutcome, (n: AuthorNotice) => string> = {
  proofed: (n) => `Your revision r${n.revisionNumber} of "${n.fixTitle}" is live`,
  returned: (n) => `Your revision r${n.revisionNumber} of "${n.fixTitle}" was returned with a note`,
  amended: (n) => `A moderator amended your revision r${n.revisionNumber} of "${n.fixTitle}"`,
};

function paragraphs(n: AuthorNotice): string[] {
  const lines: string[] = [];
  if (n.outcome === 'proofed')
    lines.push(`A moderator proofed r${n.revisionNumber}: readers now see it on the fix page. Thank you for writing it up.`);
  if (n.outcome === 'returned')
    lines.push(
      `A moderator returned r${n.revisionNumber} to you. It is kept as you wrote it; amend it and submit again when you are ready.`,
    );
  if (n.outcome === 'amended') {
    lines.push(
      `A moderator made changes to r${n.revisionNumber} and submitted them as r${n.amendedInto ?? '?'}, which another moderator will proof. Your revision is kept unchanged in the history of your revisions.`,
    );
  }
  if (n.note) lines.push(`The moderator's note: ${n.note}`);
  return lines;
}

/** The message itself, plain text and HTML. Pure, so its wording can be tested. */
export function authorNoticeMail(n: AuthorNotice): OutgoingMail {
  const url = new URL(n.path, config().PUBLIC_ORIGIN).href;
  const subject = subjects[n.outcome](n);
  const body = paragraphs(n);
  const greeting = `Hello ${n.authorName},`;
  const text = [greeting, ...body, `Open it here:\n${url}`, '-- \nBenchlore proofing desk'].join('\n\n') + '\n';
  const html =
    `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(subject)}</title></head>` +
    '<body style="margin:0;padding:24px;background:#f6f1e7;color:#1c2726;font-family:Georgia,serif;font-size:16px;line-height:1.5">' +
    `<div style="max-width:560px;margin:0 auto"><p>${escapeHtml(greeting)}</p>` +
    body.map((line) => `<p>${escapeHtml(line)}</p>`).join('') +
    `<p><a href="${escapeHtml(url)}" style="color:#0f4c4a">${escapeHtml(url)}</a></p>` +
    '<p style="font-size:13px;color:#4d5957">Benchlore proofing desk</p></div></body></html>';
  return { to: n.to, subject, text, html };
}

/** Puts the notice in the outbox: the relay being down never holds up the moderator's answer nor loses the notice. */
export async function notifyAuthor(notice: AuthorNotice): Promise<void> {
  await enqueueMail(authorNoticeMail(notice));
}

/** Looks up the author's address and sends; an author without one (deleted account) is simply not told. */
export async function notifyAuthorOf(authorId: number, notice: Omit<AuthorNotice, 'to'>): Promise<void> {
  const to = await authorEmailOf(db(), authorId);
  if (to) await notifyAuthor({ ...notice, to });
}

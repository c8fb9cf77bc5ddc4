// Our account e-mails, each with a plain-text part and a matching HTML part.
import { escapeHtml } from '../render/escape';
import type { OutgoingMail } from './send';

interface Paragraphs {
  greeting: string;
  before: string[];
  action?: { label: string; url: string };
  after: string[];
}

const signature = 'Benchlore: faults and fixes for tape and disc machines, from the bench.';

function textBody(p: Paragraphs): string {
  const parts = [p.greeting, ...p.before];
  if (p.action) parts.push(`${p.action.label}:\n${p.action.url}`);
  parts.push(...p.after, `-- \n${signature}`);
  return `${parts.join('\n\n')}\n`;
}

function htmlBody(subject: string, p: Paragraphs): string {
  const para = (line: string): string => `<p style="margin:0 0 14px">${escapeHtml(line)}</p>`;
  const action = p.action
    ? `<p style="margin:18px 0"><a href="${escapeHtml(p.action.url)}" style="background:#0f4c4a;color:#fffdf7;padding:10px 16px;border-radius:4px;text-decoration:none;font-weight:600">${escapeHtml(p.action.label)}</a></p>` +
      `<p style="margin:0 0 14px;font-size:13px;color:#4d5957">Or paste this address into your browser: <br>${escapeHtml(p.action.url)}</p>`
    : '';
  return [
    '<!doctype html><html lang="en"><head><meta charset="utf-8">',
    `<title>${escapeHtml(subject)}</title></head>`,
    '<body style="margin:0;padding:24px;background:#f6f1e7;color:#1c2726;font-family:Georgia,serif;font-size:16px;line-height:1.5">',
    '<div style="max-width:560px;margin:0 auto">',
    para(p.greeting),
    ...p.before.map(para),
    action,
    ...p.after.map(para),
    `<p style="margin:24px 0 0;font-size:13px;color:#4d5957">${escapeHtml(signature)}</p>`,
    '</div></body></html>',
  ].join('');
}

function compose(to: string, subject: string, p: Paragraphs): OutgoingMail {
  return { to, subject, text: textBody(p), html: htmlBody(subject, p) };
}

export function confirmAddressMail(to: string, name: string, url: string): OutgoingMail {
  return compose(to, 'Confirm your e-mail address for Benchlore', {
    greeting: `Hello ${name},`,
    before: [
      'Thank you for joining Benchlore. Please confirm that this address is yours: until you do, your account can read but cannot write fixes, file bench reports or report a fix.',
    ],
    action: { label: 'Confirm my address', url },
    after: ['The link works once and for 24 hours. If you did not join Benchlore, ignore this message: nothing happens without the link.'],
  });
}

export function confirmNewAddressMail(to: string, name: string, url: string): OutgoingMail {
  return compose(to, 'Confirm your new e-mail address for Benchlore', {
    greeting: `Hello ${name},`,
    before: [
      'You asked to use this address for your Benchlore account. Please confirm that it is yours; until you do, the old address stays.',
    ],
    action: { label: 'Use this address', url },
    after: ['The link works once and for 24 hours. If you did not ask for this, ignore this message: nothing changes without the link.'],
  });
}

export function addressChangedMail(to: string, name: string, newEmail: string, resetUrl: string): OutgoingMail {
  return compose(to, 'Your Benchlore account has a new e-mail address', {
    greeting: `Hello ${name},`,
    before: [`Your Benchlore account now uses ${newEmail}; mail for it no longer comes to this address.`],
    after: [
      `If you did not make this change, someone may know your password: choose a new one at ${resetUrl} with the new address, or write to the site's administrators.`,
    ],
  });
}

export function alreadyJoinedMail(to: string, signInUrl: string, resetUrl: string): OutgoingMail {
  return compose(to, 'Someone tried to join Benchlore with your address', {
    greeting: 'Hello,',
    before: ['Someone asked to create a Benchlore account with this e-mail address, but you already have one. No second account was made.'],
    action: { label: 'Sign in to Benchlore', url: signInUrl },
    after: [
      `If you have forgotten your password, choose a new one here: ${resetUrl}`,
      'If this was not you, you need do nothing: your account has not changed.',
    ],
  });
}

export function resetPasswordMail(to: string, url: string): OutgoingMail {
  return compose(to, 'Choose a new Benchlore password', {
    greeting: 'Hello,',
    before: ['Someone, probably you, asked to choose a new password for the Benchlore account that uses this address.'],
    action: { label: 'Choose a new password', url },
    after: ['The link works once and for one hour. If you did not ask, ignore this message: your password stays as it is.'],
  });
}

export function signInLinkMail(to: string, url: string): OutgoingMail {
  return compose(to, 'Your Benchlore sign-in link', {
    greeting: 'Hello,',
    before: ['Here is the sign-in link you asked for. Open it in the browser you want to be signed in on.'],
    action: { label: 'Sign in to Benchlore', url },
    after: ['The link works once and for 15 minutes. If you did not ask for it, ignore this message: nobody can sign in without it.'],
  });
}

export function noAccountMail(to: string, asked: 'a password reset' | 'a sign-in link', joinUrl: string): OutgoingMail {
  return compose(to, 'About your request to Benchlore', {
    greeting: 'Hello,',
    before: [`Someone asked Benchlore for ${asked} for this e-mail address, but no Benchlore account uses it.`],
    action: { label: 'Join Benchlore', url: joinUrl },
    after: ['If you did not ask, ignore this message: nothing has been set up for this address.'],
  });
}

/** Sent when a moderator suspends an account, and again when a suspended account asks for a sign-in link. */
export function suspendedMail(to: string, name: string | null, reason: string, rulesUrl: string): OutgoingMail {
  return compose(to, 'Your Benchlore account is suspended', {
    greeting: name ? `Hello ${name},` : 'Hello,',
    before: [
      'A moderator has suspended your Benchlore account, so it cannot sign in for now. Everyone can still read the site without an account.',
      `The reason they gave: ${reason}`,
    ],
    action: { label: 'Read the house rules', url: rulesUrl },
    after: [
      'If you think this is a mistake, the house rules say how to ask the moderators to look again. Everything you wrote is kept as it was.',
    ],
  });
}

// Checks an account form in the browser with the server's own zod schema before it is sent, and shows
// the messages where the server would. Without JavaScript the server does the same check.
import '@/lib/schemas/zod-in-browser';
import { checkAccountForm, isAccountFormName } from '@/lib/schemas/account-forms';

function stringFields(form: HTMLFormElement): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const [key, value] of new FormData(form)) if (typeof value === 'string') fields[key] = value;
  return fields;
}

function showMessages(form: HTMLFormElement, errors: Record<string, string[]>): HTMLInputElement | null {
  let first: HTMLInputElement | null = null;
  for (const input of form.querySelectorAll<HTMLInputElement>('input[name]:not([type=hidden])')) {
    const errorId = `${input.id}-error`;
    document.getElementById(errorId)?.remove();
    const described = (input.getAttribute('aria-describedby') ?? '').split(' ').filter((id) => id !== '' && id !== errorId);
    const messages = errors[input.name] ?? [];
    input.classList.toggle('border-brick', messages.length > 0);
    if (messages.length === 0) {
      input.removeAttribute('aria-invalid');
    } else {
      const list = document.createElement('ul');
      list.id = errorId;
      list.className = 'mt-1 text-sm text-brick';
      for (const message of messages) list.append(Object.assign(document.createElement('li'), { textContent: message }));
      input.after(list);
      input.setAttribute('aria-invalid', 'true');
      described.push(errorId);
      first ??= input;
    }
    if (described.length > 0) input.setAttribute('aria-describedby', described.join(' '));
    else input.removeAttribute('aria-describedby');
  }
  return first;
}

for (const form of document.querySelectorAll<HTMLFormElement>('form[data-check]')) {
  const name = form.dataset.check;
  if (!isAccountFormName(name)) continue;
  form.addEventListener('submit', (event) => {
    const first = showMessages(form, checkAccountForm(name, stringFields(form)));
    if (first) {
      event.preventDefault();
      first.focus();
    }
  });
}

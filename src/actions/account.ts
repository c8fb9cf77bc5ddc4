// The account page's forms (name and shop, confirmation mail, e-mail change, password, sessions, deleting) as one Action.
import type { ActionAPIContext } from 'astro:actions';
import { handleAccountForm } from '@/server/auth/account-forms';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { requestClientKey } from '@/server/http/rate-limit';

export function submitAccountForm(form: FormData, context: ActionAPIContext): Promise<PageFormResult> {
  return runFormAction(form, context.locals, 'manage_account', (user, fields) =>
    handleAccountForm(user, fields, requestClientKey(context)),
  );
}

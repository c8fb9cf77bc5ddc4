// The admin pages' forms: members' roles and suspensions, and search's word families.
import type { ActionAPIContext } from 'astro:actions';
import { handleAdminUserForm } from '@/server/auth/admin-users';
import { db } from '@/server/core/db';
import { runFormAction, type PageFormResult } from '@/server/http/forms';
import { handleWordFamilyForm } from '@/server/search/word-family-admin';

type Context = Pick<ActionAPIContext, 'locals'>;

/** Grant or revoke a role (admins; checked per form), suspend or lift a suspension (moderators and admins). */
export function submitAdminUserForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'suspend_user', (user, fields) => handleAdminUserForm(user, fields));
}

/** Add, change, retire or restore a word family (editors and above). */
export function submitWordFamilyForm(form: FormData, { locals }: Context): Promise<PageFormResult> {
  return runFormAction(form, locals, 'manage_word_families', (user, fields) => handleWordFamilyForm(db(), user, fields));
}

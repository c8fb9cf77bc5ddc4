import { describe, expect, it } from 'vitest';
import { checkAccountForm, formInput, isAccountFormName } from '@/lib/schemas/account-forms';

describe('account form checks (shared by the browser and the server)', () => {
  it('names each field that breaks its rule with the server’s own message', () => {
    expect(checkAccountForm('sign-up', { name: 'X', email: 'not-an-address', password: 'short', shopName: '' })).toEqual({
      name: ['Use at least 2 characters for your name.'],
      email: ['Enter an e-mail address such as name@example.org.'],
      password: ['Use at least 10 characters.'],
    });
  });

  it('passes a good form, leaving a blank optional field out rather than calling it too short', () => {
    expect(
      checkAccountForm('sign-up', { name: 'Ada Brightwell', email: 'ada@example.test', password: 'x'.repeat(12), shopName: '' }),
    ).toEqual({});
    expect(formInput('delete-account', { password: '', confirm: 'delete' })).toEqual({ confirm: 'delete' });
    expect(checkAccountForm('delete-account', { password: '', confirm: 'remove' })).toEqual({
      confirm: ['Type the word delete to confirm.'],
    });
  });

  it('knows only its own form names', () => {
    expect(isAccountFormName('profile')).toBe(true);
    expect(isAccountFormName('toString')).toBe(false);
    expect(isAccountFormName(undefined)).toBe(false);
  });
});

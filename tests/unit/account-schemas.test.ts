import { describe, expect, it } from 'vitest';
import { passwordSchema, signUpSchema } from '../../src/lib/account-schemas';
import { zodIssuesToFields } from '../../src/lib/validation';

describe('the sign-up schema', () => {
  it('accepts a good account and normalises the e-mail to lower case', () => {
    const parsed = signUpSchema.parse({ email: '  Crew@Example.Test ', password: 'twelve chars ok', name: ' Ana ' });
    expect(parsed).toEqual({ email: 'crew@example.test', password: 'twelve chars ok', name: 'Ana' });
  });

  it('names each bad field with what to fix', () => {
    const result = signUpSchema.safeParse({ email: 'not-an-address', password: 'short', name: '' });
    expect(result.success).toBe(false);
    const fields = zodIssuesToFields(result.error!);
    expect(fields.email).toMatch(/e-mail address/);
    expect(fields.password).toMatch(/at least 12 characters/);
    expect(fields.name).toMatch(/name/);
  });

  it('refuses 11 characters and accepts 12 (the minimum length)', () => {
    expect(passwordSchema.safeParse('abcdefghijk').success).toBe(false);
    expect(passwordSchema.safeParse('abcdefghijkl').success).toBe(true);
  });

  it('refuses a password of one repeated character and a common one', () => {
    expect(passwordSchema.safeParse('aaaaaaaaaaaaaaaa').success).toBe(false);
    expect(passwordSchema.safeParse('Password1234').success).toBe(false);
  });

  it('refuses wrong types with a message rather than throwing', () => {
    const result = signUpSchema.safeParse({ email: 42, password: null, name: ['x'] });
    expect(result.success).toBe(false);
    expect(Object.keys(zodIssuesToFields(result.error!)).sort()).toEqual(['email', 'name', 'password']);
  });
});

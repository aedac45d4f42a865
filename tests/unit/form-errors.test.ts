import { describe, expect, it } from 'vitest';
import { ApiRequestError } from '@/lib/api-client';
import { formErrorsFromRequest, placedMessages, validateForm } from '@/lib/form-errors';
import { signInSchema, signUpSchema } from '@/shared/schemas/auth';

const apiError = (init: ConstructorParameters<typeof ApiRequestError>[0]) => new ApiRequestError(init);

describe('validateForm', () => {
  it('answers the parsed, normalised value when the input is valid', () => {
    const result = validateForm(signInSchema, { email: '  Keeper@Example.org ', password: 'x' });
    expect(result).toEqual({ ok: true, data: { email: 'keeper@example.org', password: 'x' } });
  });

  it('answers one message per invalid field, keyed by field name', () => {
    const result = validateForm(signUpSchema, { email: 'nope', password: 'short', displayName: '' });
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(Object.keys(result.errors.fields).sort()).toEqual(['displayName', 'email', 'password']);
    expect(result.errors.banner).toBeNull();
  });
});

describe('formErrorsFromRequest', () => {
  it('puts a duplicate e-mail under the e-mail field and shows no banner', () => {
    const e = apiError({ status: 409, code: 'conflict', message: 'Taken.', fields: { email: 'That e-mail already has an account.' } });
    expect(formErrorsFromRequest(e, ['email', 'password', 'displayName'])).toEqual({
      fields: { email: 'That e-mail already has an account.' },
      banner: null,
    });
  });

  it('moves messages for fields the form does not show into the banner', () => {
    const e = apiError({ status: 400, code: 'validation', message: 'Some fields need attention.', fields: { token: 'Link expired.', password: 'Too common.' } });
    expect(formErrorsFromRequest(e, ['password'])).toEqual({ fields: { password: 'Too common.' }, banner: 'Link expired.' });
  });

  it('uses the server message as the banner when no field message fits', () => {
    const e = apiError({ status: 401, code: 'unauthorized', message: 'E-mail or password is wrong.' });
    expect(formErrorsFromRequest(e, ['email', 'password'])).toEqual({ fields: {}, banner: 'E-mail or password is wrong.' });
  });

  it('adds the wait time to a rate-limit banner', () => {
    const e = apiError({ status: 429, code: 'too_many_requests', message: 'Too many attempts.', retryAfterSeconds: 600 });
    expect(formErrorsFromRequest(e, ['email'])).toEqual({ fields: {}, banner: 'Too many attempts. Try again in 10 minutes.' });
  });

  it('keeps the rate-limit message alone when the server gave no wait time', () => {
    const e = apiError({ status: 429, code: 'too_many_requests', message: 'Too many attempts.' });
    expect(formErrorsFromRequest(e, ['email']).banner).toBe('Too many attempts.');
  });

  it('gives a generic banner for something that is not an API error', () => {
    expect(formErrorsFromRequest(new Error('boom'), ['email'])).toEqual({ fields: {}, banner: 'Something went wrong. Please try again.' });
  });
});

describe('placedMessages', () => {
  it('leads a numbered item\'s message with the item, counted from 1, never with the request path (issue 15)', () => {
    const text = placedMessages({ 'events.0.fish.lengthCm': 'A fish that is not in the species list needs its length (or its weight).', 'livestock.2.lengthCm': 'Give its length.', horizonDays: 'Too long.' });
    expect(text).toBe('Event 1: A fish that is not in the species list needs its length (or its weight). Fish 3: Give its length. Too long.');
    expect(text).not.toMatch(/events\.|lengthCm/);
  });
});

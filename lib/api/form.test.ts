import { describe, expect, it } from 'vitest';
import { newChannelSchema } from '@/lib/channels/schemas';
import { updateProfileSchema } from '@/lib/users/schemas';
import { ApiError } from './client';
import { fieldErrorsOfFailure, validateForm } from './form';

describe('validateForm', () => {
  it('gives the parsed data when the values pass the shared schema', () => {
    expect(validateForm(updateProfileSchema, { name: '  Dev Okafor ', emailOptOut: false })).toEqual({ ok: true, data: { name: 'Dev Okafor', emailOptOut: false } });
  });

  it('gives one message per field, keyed like the server’s 400', () => {
    const result = validateForm(newChannelSchema, { name: '' });
    expect(result.ok).toBe(false);
    if (!result.ok) expect(Object.keys(result.fields)).toEqual(['name']);
  });
});

describe('fieldErrorsOfFailure', () => {
  it('takes the field messages of a refused request and nothing from other failures', () => {
    expect(fieldErrorsOfFailure(new ApiError(400, 'invalid_input', 'Check the fields.', { name: 'Too long.' }))).toEqual({ name: 'Too long.' });
    expect(fieldErrorsOfFailure(new Error('offline'))).toEqual({});
  });
});

import { describe, expect, it } from 'vitest';
import { newChannelSchema } from '@/lib/channels/schemas';
import { updateProfileSchema } from '@/lib/users/schemas';
import { ApiError } from './client';
import { fieldErrorsOfFailure, messageOfFailure, renameFields, validateForm } from './form';

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

describe('messageOfFailure', () => {
  it('shows the server’s message for a refused request and the form’s fallback otherwise', () => {
    expect(messageOfFailure(new ApiError(409, 'conflict', 'Already taken.'), 'Could not save.')).toBe('Already taken.');
    expect(messageOfFailure(new TypeError('boom'), 'Could not save.')).toBe('Could not save.');
  });
});

describe('renameFields', () => {
  it('copies a server field message to the form’s name for it and keeps the rest', () => {
    expect(renameFields({ 'contacts.0.email': 'Not an address.', title: 'Required.' }, { 'contacts.0.email': 'contactEmail', name: 'sponsorName' })).toEqual({
      'contacts.0.email': 'Not an address.',
      contactEmail: 'Not an address.',
      title: 'Required.',
    });
  });
});

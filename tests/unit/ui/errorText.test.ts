// Failures in words: the store's own sentence first, else the error's message, and never "[object Object]" or a
// blank for the things a promise can be rejected with.
import { describe, expect, it } from 'vitest';
import { errorText, storeSentence } from '../../../src/ui/errorText';
import { StoreError } from '../../../src/store/errors';

describe('errorText', () => {
  it('gives the store’s own sentence, an error’s message, or the value itself', () => {
    expect(errorText(new StoreError('The device has no room left for Rodside’s data.'))).toBe('The device has no room left for Rodside’s data.');
    expect(errorText(new TypeError('x is undefined'))).toBe('x is undefined');
    expect(errorText('aborted')).toBe('aborted');
    expect(errorText(null)).toBe('null');
    expect(errorText(undefined)).toBe('undefined');
  });

  it('gives the store’s own sentence alone, or nothing, so a screen can put its own sentence in its place', () => {
    expect(storeSentence(new StoreError('The device has no room left for Rodside’s data.'))).toBe('The device has no room left for Rodside’s data.');
    expect(storeSentence(new TypeError('x is undefined'))).toBeUndefined();
    expect(storeSentence(null)).toBeUndefined();
    expect(storeSentence(undefined)).toBeUndefined();
  });
});

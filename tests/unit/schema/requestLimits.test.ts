import { describe, expect, it } from 'vitest';
import { JSON_BODY_MAX_BYTES, UPLOAD_MAX_BYTES, byteSizeText } from '../../../shared/schema/requestLimits';

// Expected texts worked out by hand: 1 KB = 1024 bytes, 1 MB = 1024 KB (the binary units the body parsers use).
describe('byteSizeText', () => {
  it('writes the API limits as the docs and messages name them', () => {
    expect(byteSizeText(JSON_BODY_MAX_BYTES)).toBe('256 KB');
    expect(byteSizeText(UPLOAD_MAX_BYTES)).toBe('10 MB');
  });

  it('writes whole sizes without decimals and others with one', () => {
    expect(byteSizeText(1024)).toBe('1 KB');
    expect(byteSizeText(1536)).toBe('1.5 KB');
    expect(byteSizeText(1024 * 1024)).toBe('1 MB');
    expect(byteSizeText(1.25 * 1024 * 1024 + 1)).toBe('1.3 MB');
  });

  it('writes small sizes in bytes', () => {
    expect(byteSizeText(0)).toBe('0 bytes');
    expect(byteSizeText(1)).toBe('1 byte');
    expect(byteSizeText(1023)).toBe('1023 bytes');
  });

  it('refuses a value that is not a size', () => {
    expect(() => byteSizeText(-1)).toThrow(RangeError);
    expect(() => byteSizeText(Number.NaN)).toThrow(RangeError);
  });
});

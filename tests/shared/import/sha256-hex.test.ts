import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { sha256Hex } from '../../../shared/import';

describe('sha256Hex(text)', () => {
  // FIPS 180-4 examples (NIST CSRC "Example Algorithms", SHA-256: one-block, two-block and empty messages).
  it.each([
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    ['abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq', '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1'],
    ['', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  ])('gives the published digest of %j', (text, digest) => {
    expect(sha256Hex(text)).toBe(digest);
  });

  it('agrees with node:crypto on UTF-8 text at every padding boundary (lengths 0–130, multibyte characters)', () => {
    for (let n = 0; n <= 130; n++) {
      const text = 'γ'.repeat(n % 3) + 'x'.repeat(n);
      expect(sha256Hex(text)).toBe(createHash('sha256').update(text, 'utf8').digest('hex'));
    }
  });
});

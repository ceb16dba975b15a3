import { describe, expect, it } from 'vitest';
import { encodeBase32, newId } from '../../server/lib/ids';
import { Id } from '../../server/contracts/common';

const bytes = (s: string) => new TextEncoder().encode(s);

describe('ids', () => {
  // RFC 4648 §10 test vectors (base32, upper case with "=" padding there; ours is lower case, unpadded)
  it.each([
    ['', ''],
    ['f', 'my'],
    ['fo', 'mzxq'],
    ['foo', 'mzxw6'],
    ['foob', 'mzxw6yq'],
    ['fooba', 'mzxw6ytb'],
    ['foobar', 'mzxw6ytboi'],
  ])('encodeBase32(%j) is %j (RFC 4648 test vector)', (input, expected) => {
    expect(encodeBase32(bytes(input))).toBe(expected);
  });

  it('newId() gives 24 lower-case base32 characters that the Id contract accepts', () => {
    const id = newId();
    expect(id).toMatch(/^[a-z2-7]{24}$/);
    expect(Id.safeParse(id).success).toBe(true);
  });

  it('newId() does not repeat over 10 000 ids', () => {
    const ids = new Set(Array.from({ length: 10_000 }, newId));
    expect(ids.size).toBe(10_000);
  });
});

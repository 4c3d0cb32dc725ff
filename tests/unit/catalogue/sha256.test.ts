import { createHash } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { sha256Hex, sha256HexOfBytes, utf8Encode } from '../../../shared/catalogue/sha256'

describe('sha256Hex', () => {
  it('when hashing the FIPS 180-2 test messages, returns the published digests', () => {
    // FIPS PUB 180-2 Appendix B.1 and B.2 (from memory; also checked against node:crypto below).
    expect(sha256Hex('abc')).toBe(
      'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad',
    )
    expect(sha256Hex('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq')).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    )
    // Empty message (well-known digest, from memory).
    expect(sha256Hex('')).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855')
  })

  it('when hashing messages of every length around the block boundaries, matches node:crypto', () => {
    // node:crypto (OpenSSL) as the independent reference implementation.
    for (let n = 0; n <= 200; n++) {
      const text = 'x'.repeat(n) + 'ν₂—'.repeat(n % 3)
      expect(sha256Hex(text), `length ${n}`).toBe(
        createHash('sha256').update(text, 'utf8').digest('hex'),
      )
    }
  })

  it('when encoding non-ASCII text, returns the same UTF-8 bytes as Node Buffer', () => {
    const text = 'CO₂ ν₂ 15 µm — 😀 \u{10348}'
    expect(Array.from(utf8Encode(text))).toEqual(Array.from(Buffer.from(text, 'utf8')))
    expect(sha256HexOfBytes(new Uint8Array([0x61, 0x62, 0x63]))).toBe(sha256Hex('abc'))
  })
})

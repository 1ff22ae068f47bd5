/* SPDX-License-Identifier: MIT */
// Doubles as C99's %a text with the GNU C library, the format of
// tests/refvectors/expected.txt ("0x1.8p+1", "-0x0p+0", "inf", "-nan"),
// written from the bits as tests/refvectors/refvectors.c does, and read back.
const buf = new DataView(new ArrayBuffer(8));

export function bitsOf(x) {
  buf.setFloat64(0, x);
  return buf.getBigUint64(0);
}

export function fromBits(b) {
  buf.setBigUint64(0, b);
  return buf.getFloat64(0);
}

export function formatHex(x) {
  const bits = bitsOf(x);
  const neg = bits >> 63n ? '-' : '';
  const mant = bits & 0xfffffffffffffn;
  let exp = Number((bits >> 52n) & 0x7ffn);
  if (exp === 0x7ff) return neg + (mant ? 'nan' : 'inf');
  if (exp === 0 && mant === 0n) return `${neg}0x0p+0`;
  const lead = exp === 0 ? 0 : 1;
  exp = exp === 0 ? -1022 : exp - 1023;
  const digits = mant.toString(16).padStart(13, '0').replace(/0+$/, '');
  return `${neg}0x${lead}${digits ? `.${digits}` : ''}p${exp < 0 ? '-' : '+'}${Math.abs(exp)}`;
}

export function parseHex(text) {
  const m = text.match(/^(-?)(?:(inf)|(nan)|0x([01])(?:\.([0-9a-f]+))?p([+-]\d+))$/);
  if (!m) throw new Error(`not a %a double: ${text}`);
  const sign = m[1] ? 1n << 63n : 0n;
  if (m[2]) return fromBits(sign | (0x7ffn << 52n));
  if (m[3]) return fromBits(sign | (0x7ffn << 52n) | (1n << 51n));
  const lead = m[4] === '1';
  const frac = BigInt(`0x${(m[5] || '').padEnd(13, '0')}`);
  let exp = Number(m[6]);
  if (!lead && frac === 0n) return fromBits(sign);
  const field = lead ? BigInt(exp + 1023) : 0n;
  if (lead && (exp < -1022 || exp > 1023)) throw new Error(`exponent out of range: ${text}`);
  return fromBits(sign | (field << 52n) | frac);
}

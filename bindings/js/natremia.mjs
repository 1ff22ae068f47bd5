/* SPDX-License-Identifier: MIT */
// natremia for JavaScript: the C library compiled to WebAssembly
// (natremia.wasm, built by build.sh), with one method per public C
// function, named as the C function without "ntr_".
//
// The methods are built from natremia_api.mjs, which gen_api.mjs writes
// from include/natremia.h: every parameter's role (input, output, array,
// struct, watcher state) follows from its C type, and struct layouts are
// computed with the wasm32 rules (checked against the compiler by the
// tests). No network access at run time: node reads the .wasm file beside
// this module, a browser fetches it relative to import.meta.url.
//
// Estimates for decision support, not orders; verify with measured values;
// follow local protocols and licensed clinical judgement.
import { api } from './natremia_api.mjs';

/** A non-OK status from the library. */
export class NatremiaError extends Error {
  constructor(status, message, fn, argument) {
    super(message);
    this.name = 'NatremiaError';
    this.status = status;
    this.function = fn;
    this.argument = argument === undefined ? null : argument;
  }
}

export const constants = Object.freeze({ ...api.constants });

const OK = api.constants.NTR_OK;
const ERR_NONFINITE = api.constants.NTR_ERR_NONFINITE;
const ERR_RANGE = api.constants.NTR_ERR_RANGE;
const ERR_CAPACITY = api.constants.NTR_ERR_CAPACITY;
const ERR_ARG = api.constants.NTR_ERR_ARG;

// ---- struct layouts (wasm32: int, long, size_t and pointers are 4 bytes) ----

const SCALARS = {
  double: { size: 8, get: 'getFloat64', set: 'setFloat64' },
  float: { size: 4, get: 'getFloat32', set: 'setFloat32' },
  int: { size: 4, get: 'getInt32', set: 'setInt32' },
  'unsigned int': { size: 4, get: 'getUint32', set: 'setUint32' },
  'unsigned long': { size: 4, get: 'getUint32', set: 'setUint32' },
  size_t: { size: 4, get: 'getUint32', set: 'setUint32' },
};
const POINTER = { size: 4, get: 'getUint32', set: 'setUint32' };
const OPAQUE = new Set(['ntr_watch', 'ntr_course_watch']);

const layouts = new Map();

function scalarOf(field) {
  if (field.pointer) return POINTER;
  const s = SCALARS[field.type];
  if (!s) throw new Error(`natremia: no wasm32 size for ${field.type}`);
  return s;
}

/** Size, alignment and member offsets of a public struct. */
export function layout(name) {
  if (layouts.has(name)) return layouts.get(name);
  const members = api.structs[name];
  if (!members) throw new Error(`natremia: unknown struct ${name}`);
  let offset = 0;
  let align = 1;
  const fields = [];
  for (const m of members) {
    let size;
    let a;
    let sub = null;
    if (!m.pointer && api.structs[m.type]) {
      sub = layout(m.type);
      size = sub.size;
      a = sub.align;
    } else {
      size = scalarOf(m).size;
      a = size;
    }
    offset = Math.ceil(offset / a) * a;
    fields.push({ ...m, offset, size, sub });
    offset += size * (m.count || 1);
    align = Math.max(align, a);
  }
  const out = { name, size: Math.ceil(offset / align) * align, align, fields };
  layouts.set(name, out);
  return out;
}

// ---- the instance ----------------------------------------------------------

async function wasmBytes(source) {
  if (source instanceof ArrayBuffer || ArrayBuffer.isView(source)) return source;
  const isNode = typeof process !== 'undefined' && process.versions && process.versions.node;
  if (isNode) {
    const { readFile } = await import('node:fs/promises');
    const where = source || process.env.NATREMIA_WASM || new URL('./natremia.wasm', import.meta.url);
    return readFile(where);
  }
  const res = await fetch(source || new URL('./natremia.wasm', import.meta.url));
  if (!res.ok) throw new Error(`natremia: cannot load natremia.wasm (${res.status})`);
  return res.arrayBuffer();
}

class Memory {
  constructor(exports) {
    this.x = exports;
  }
  get view() {
    return new DataView(this.x.memory.buffer);
  }
  alloc(bytes) {
    const p = this.x.ntrjs_alloc(Math.max(bytes, 1));
    if (p === 0) throw new RangeError('natremia: argument arena full (input too large)');
    return p;
  }
  cstring(p) {
    if (p === 0) return null;
    const bytes = new Uint8Array(this.x.memory.buffer);
    let end = p;
    while (bytes[end] !== 0) end++;
    return new TextDecoder().decode(bytes.subarray(p, end));
  }
  putString(s) {
    const enc = new TextEncoder().encode(String(s));
    const p = this.alloc(enc.length + 1);
    new Uint8Array(this.x.memory.buffer).set(enc, p);
    return p;
  }
  writeStruct(lay, p, obj) {
    const v = this.view;
    for (const f of lay.fields) {
      let value = obj ? obj[f.name] : undefined;
      if (f.name === 'struct_size' && value === undefined) value = lay.size;
      if (value === undefined || value === null) continue;
      const n = f.count || 1;
      for (let i = 0; i < n; i++) {
        const item = f.count ? value[i] : value;
        if (item === undefined) continue;
        const at = p + f.offset + i * f.size;
        if (f.sub) this.writeStruct(f.sub, at, item);
        else if (f.pointer) throw new TypeError(`natremia: ${lay.name}.${f.name} cannot be set`);
        else v[scalarOf(f).set](at, Number(item), true);
      }
    }
  }
  readStruct(lay, p) {
    const v = this.view;
    const obj = {};
    for (const f of lay.fields) {
      if (f.name.startsWith('reserved')) continue;
      const n = f.count || 1;
      const items = [];
      for (let i = 0; i < n; i++) {
        const at = p + f.offset + i * f.size;
        if (f.sub) items.push(this.readStruct(f.sub, at));
        else if (f.pointer) items.push(this.cstring(v.getUint32(at, true)));
        else items.push(v[scalarOf(f).get](at, true));
      }
      obj[f.name] = f.count ? items : items[0];
    }
    return obj;
  }
  putArray(lay, items) {
    const list = items ? Array.from(items) : [];
    const p = this.alloc(lay.size * list.length);
    list.forEach((item, i) => this.writeStruct(lay, p + i * lay.size, item));
    return { p, n: list.length };
  }
  readArray(lay, p, n) {
    const out = [];
    for (let i = 0; i < n; i++) out.push(this.readStruct(lay, p + i * lay.size));
    return out;
  }
}

/** The state of a watcher (ntr_watch, ntr_course_watch), kept as bytes. */
class WatchState {
  constructor(type, bytes) {
    this.type = type;
    this.bytes = bytes;
  }
}

// ---- parameter roles -----------------------------------------------------

const isStruct = (p) => !!api.structs[p.type];

function roles(fn) {
  const p = fn.params;
  const batch = fn.name.startsWith('ntr_batch_');
  const out = [];
  for (let i = 0; i < p.length; i++) {
    const a = p[i];
    const next = p[i + 1];
    const countNext = next && next.type === 'size_t' && !next.pointer && /^(n|n_[a-z]+|capacity)$/.test(next.name);
    if (a.type === 'char' && a.pointer && a.const) out.push({ role: 'string', p: a });
    else if (OPAQUE.has(a.type)) {
      out.push({ role: /_init$/.test(fn.name) ? 'stateOut' : 'stateIn', p: a });
    } else if (isStruct(a) && a.pointer && a.const && countNext) {
      out.push({ role: 'arrayIn', p: a }, { role: 'count', p: next, of: a.name });
      i++;
    } else if (isStruct(a) && a.pointer && !a.const && countNext && p[i + 2] && p[i + 2].pointer) {
      out.push({ role: 'seriesOut', p: a }, { role: 'capacity', p: next }, { role: 'seriesCount', p: p[i + 2] });
      i += 2;
    } else if (isStruct(a) && a.pointer && a.const) out.push({ role: 'structIn', p: a });
    else if (isStruct(a) && a.pointer) out.push({ role: batch ? 'rowsOut' : 'structOut', p: a });
    else if (batch && i === 0 && a.type === 'size_t') out.push({ role: 'rows', p: a });
    else if (batch && a.name === 'report_size') out.push({ role: 'reportSize', p: a });
    else if (batch && a.pointer && a.const) out.push({ role: 'column', p: a });
    else if (batch && a.pointer && a.name !== 'failed') out.push({ role: 'columnOut', p: a });
    else if (a.pointer) out.push({ role: 'out', p: a });
    else out.push({ role: 'in', p: a });
  }
  return out;
}

/**
 * How the JavaScript method of a C function takes and returns its values:
 * { inputs: [{ name, role, type }], outputs: [{ name, role, type }] }, from
 * the parameters' C types (used by gen_api.mjs for natremia.d.ts).
 */
export function signature(cName) {
  const fn = api.functions.find((f) => f.name === cName);
  if (!fn) throw new Error(`natremia: unknown function ${cName}`);
  const rs = roles(fn);
  const pick = (r) => ({ name: r.p.name, role: r.role, type: r.p.type });
  return {
    inputs: rs.filter((r) => INPUT_ROLES.has(r.role)).map(pick),
    outputs: rs.filter((r) => OUTPUT_ROLES.has(r.role)).map(pick),
    ret: fn.ret,
  };
}

const TYPED = {
  double: Float64Array,
  int: Int32Array,
  size_t: Uint32Array,
};

const INPUT_ROLES = new Set(['string', 'stateIn', 'arrayIn', 'structIn', 'column', 'in']);
const OUTPUT_ROLES = new Set(['out', 'structOut', 'stateOut', 'seriesOut', 'columnOut', 'rowsOut']);

// ---- method construction -----------------------------------------------------

function makeMethod(lib, fn) {
  const mem = lib.mem;
  const cfn = lib.x[fn.name];
  const rs = roles(fn);
  const inputs = rs.filter((r) => INPUT_ROLES.has(r.role));
  const short = fn.name.replace(/^ntr_/, '');

  // Functions that return something other than a status.
  if (fn.ret.type === 'char' && fn.ret.pointer) return (...a) => mem.cstring(cfn(...a));
  if (fn.ret.type === 'unsigned long') return (...a) => cfn(...a) >>> 0;

  // One raw call: returns { status, outputs } with outputs read back only
  // on success; the arena is released afterwards in every case.
  function invoke(args, capacity) {
    const mark = lib.x.ntrjs_mark();
    try {
      const cargs = [];
      const after = [];
      const byName = {};
      inputs.forEach((r, k) => { byName[r.p.name] = args[k]; });
      let rows = 0;
      const firstColumn = rs.find((r) => r.role === 'column');
      if (firstColumn) {
        const v = byName[firstColumn.p.name];
        rows = v ? v.length : 0;
        if (firstColumn.p.name === 'offsets') rows = Math.max(rows - 1, 0);
      }
      for (const r of rs) {
        const a = r.p;
        const value = byName[a.name];
        switch (r.role) {
          case 'in':
            cargs.push(Number(value));
            break;
          case 'string':
            cargs.push(value === undefined || value === null ? 0 : mem.putString(value));
            break;
          case 'structIn':
            if (value === undefined || value === null) cargs.push(0);
            else {
              const lay = layout(a.type);
              const p = mem.alloc(lay.size);
              mem.writeStruct(lay, p, value);
              cargs.push(p);
            }
            break;
          case 'arrayIn': {
            const { p, n } = mem.putArray(layout(a.type), value);
            cargs.push(value === undefined || value === null ? 0 : p);
            byName[`#${a.name}`] = n;
            break;
          }
          case 'count': {
            const c = byName[`#${r.of}`];
            cargs.push(c);
            break;
          }
          case 'stateIn':
          case 'stateOut': {
            const lay = layout(a.type);
            const p = mem.alloc(lay.size);
            if (r.role === 'stateIn') {
              if (!(value instanceof WatchState) || value.type !== a.type) {
                throw new TypeError(`natremia.${short}: ${a.name} must come from ${a.type.replace(/^ntr_/, '')}_init()`);
              }
              new Uint8Array(lib.x.memory.buffer, p, lay.size).set(value.bytes);
            }
            cargs.push(p);
            if (!a.const) after.push({ r, p, lay, value });
            break;
          }
          case 'structOut': {
            const lay = layout(a.type);
            const p = mem.alloc(lay.size);
            mem.writeStruct(lay, p, {});
            cargs.push(p);
            after.push({ r, p, lay });
            break;
          }
          case 'out': {
            const p = mem.alloc(8);
            cargs.push(p);
            after.push({ r, p });
            break;
          }
          case 'seriesOut': {
            const lay = layout(a.type);
            const p = capacity ? mem.alloc(lay.size * capacity) : 0;
            cargs.push(p);
            after.push({ r, p, lay });
            break;
          }
          case 'capacity':
            cargs.push(capacity || 0);
            break;
          case 'seriesCount': {
            const p = mem.alloc(4);
            cargs.push(p);
            byName['#count'] = p;
            break;
          }
          case 'rows':
            cargs.push(rows);
            break;
          case 'reportSize':
            cargs.push(layout(rs.find((x) => x.role === 'rowsOut').p.type).size);
            break;
          case 'column': {
            const T = TYPED[a.type];
            const arr = value instanceof T ? value : T.from(value || []);
            const p = mem.alloc(arr.byteLength);
            new Uint8Array(lib.x.memory.buffer, p, arr.byteLength).set(
              new Uint8Array(arr.buffer, arr.byteOffset, arr.byteLength));
            cargs.push(p);
            break;
          }
          case 'columnOut': {
            const T = TYPED[a.type];
            const p = mem.alloc(rows * T.BYTES_PER_ELEMENT);
            cargs.push(p);
            after.push({ r, p, T });
            break;
          }
          case 'rowsOut': {
            const lay = layout(a.type);
            const p = mem.alloc(lay.size * rows);
            cargs.push(p);
            after.push({ r, p, lay });
            break;
          }
          default:
            throw new Error(`natremia: role ${r.role}`);
        }
      }
      // The batch "failed" count: a sentinel shows whether the call got past
      // its call-level checks (only then is it written).
      const failedOut = after.find((x) => x.r.role === 'out' && x.r.p.name === 'failed');
      if (failedOut) mem.view.setUint32(failedOut.p, 0xffffffff, true);
      const status = cfn(...cargs);
      const v = mem.view;
      const outputs = {};
      const countP = byName['#count'];
      const written = countP ? v.getUint32(countP, true) : 0;
      if (failedOut && v.getUint32(failedOut.p, true) === 0xffffffff) return { status, outputs, batchRejected: true };
      if (status !== OK && !failedOut) return { status, outputs, needed: written };
      for (const x of after) {
        const name = x.r.p.name;
        switch (x.r.role) {
          case 'out': {
            const t = x.r.p.type;
            outputs[name] = t === 'double' ? v.getFloat64(x.p, true)
              : t === 'int' ? v.getInt32(x.p, true) : v.getUint32(x.p, true);
            break;
          }
          case 'structOut':
            outputs[name] = mem.readStruct(x.lay, x.p);
            break;
          case 'stateOut':
            outputs[name] = new WatchState(x.lay.name, new Uint8Array(lib.x.memory.buffer, x.p, x.lay.size).slice());
            break;
          case 'stateIn':
            x.value.bytes = new Uint8Array(lib.x.memory.buffer, x.p, x.lay.size).slice();
            break;
          case 'seriesOut':
            outputs[name] = mem.readArray(x.lay, x.p, written);
            break;
          case 'columnOut':
            outputs[name] = new x.T(lib.x.memory.buffer, x.p, rows).slice();
            break;
          case 'rowsOut':
            outputs[name] = mem.readArray(x.lay, x.p, rows);
            break;
          default:
            break;
        }
      }
      return { status, outputs };
    } finally {
      lib.x.ntrjs_release(mark);
    }
  }

  // The argument that failed. Inputs are checked in argument order, each
  // for finiteness and range together (docs/ranges.md), so: NaN or infinity
  // is the first non-finite number; for a range error, putting NaN in place
  // of an argument checked at or before the failing one changes the status
  // to NTR_ERR_NONFINITE, and in place of a later one it does not. The
  // failing argument is the last one for which it does. Structured inputs
  // (series, flows, limits) are named when no number is.
  const numbers = inputs.map((r, k) => ({ r, k })).filter((e) => e.r.role === 'in' && e.r.p.type === 'double');
  const structured = inputs.filter((r) => r.role === 'arrayIn' || r.role === 'structIn' || r.role === 'column');
  const enums = inputs.filter((r) => r.role === 'in' && r.p.type !== 'double');
  function failedArgument(status, args) {
    if (status === ERR_NONFINITE) {
      const e = numbers.find((x) => !Number.isFinite(Number(args[x.k])));
      if (e) return e.r.p.name;
    } else if (status === ERR_RANGE) {
      let found = null;
      for (const e of numbers) {
        const probe = args.slice();
        probe[e.k] = NaN;
        if (invoke(probe, 0).status === ERR_NONFINITE) found = e.r.p.name;
      }
      if (found) return found;
    } else if (status === ERR_ARG && enums.length === 1 && structured.length === 0) {
      return enums[0].p.name;
    } else {
      return null;
    }
    return structured.length === 1 ? structured[0].p.name : null;
  }

  const fail = (status, args) => {
    throw new NatremiaError(status, lib.statusMessage(status), short, failedArgument(status, args));
  };
  const outs = rs.filter((r) => OUTPUT_ROLES.has(r.role));
  const hasSeries = rs.some((r) => r.role === 'seriesOut');

  const method = function (...args) {
    let res = invoke(args, 0);
    if (hasSeries && res.status === ERR_CAPACITY && res.needed > 0) res = invoke(args, res.needed);
    if (res.batchRejected || (res.status !== OK && !('failed' in res.outputs))) fail(res.status, args);
    if ('failed' in res.outputs) return { ...res.outputs, result: res.status };
    if (outs.length === 1) return res.outputs[outs[0].p.name];
    return res.outputs;
  };
  Object.defineProperty(method, 'name', { value: short });
  method.parameters = inputs.map((r) => r.p.name);
  method.results = outs.map((r) => r.p.name);
  return method;
}

/**
 * Load the WebAssembly module and return the library object.
 * @param {object} [options] { wasm: path, URL, ArrayBuffer or typed array }
 */
export async function load(options = {}) {
  const bytes = await wasmBytes(options.wasm);
  const { instance } = await WebAssembly.instantiate(bytes, {});
  const x = instance.exports;
  const lib = { x, mem: new Memory(x) };
  lib.statusMessage = (s) => lib.mem.cstring(x.ntr_status_message(s));
  const out = { constants, NatremiaError, layout, exports: x };
  for (const fn of api.functions) {
    out[fn.name.replace(/^ntr_/, '')] = makeMethod(lib, fn);
  }
  return Object.freeze(out);
}

export default load;

/* SPDX-License-Identifier: MIT */
// All of tests/refvectors/expected.txt, bit for bit, from the C program
// that writes it (tests/refvectors/refvectors.c with the contract table
// tests/fuzz/ntr_contract.c) compiled by build.sh to WebAssembly over the
// same lib/ objects as natremia.wasm, and run here under node's WASI.
// This covers the lines whose inputs (series, flows) the C generator makes;
// test/refvectors.test.mjs replays the others through the JS methods.
import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync, existsSync } from 'node:fs';
import { execFileSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const expectedPath = process.env.NATREMIA_REFVECTORS ||
  join(here, '..', '..', '..', 'tests', 'refvectors', 'expected.txt');
const programPath = process.env.NATREMIA_REFVECTORS_WASM || join(here, '..', 'refvectors.wasm');
const required = process.env.NATREMIA_JS_REQUIRE_ALL === '1';

test('the C reference-vector program under node writes expected.txt exactly',
  { skip: !existsSync(programPath) && !required && 'refvectors.wasm not built (needs wasi-libc; sh build.sh)' },
  () => {
    const major = Number(process.versions.node.split('.')[0]);
    const flags = major < 20 ? ['--experimental-wasi-unstable-preview1'] : [];
    const text = execFileSync(process.execPath,
      [...flags, '--no-warnings', join(here, '..', 'testsupport', 'run-wasi.mjs'), programPath],
      { encoding: 'utf8', maxBuffer: 64 * 1024 * 1024 });
    const got = text.split('\n');
    const want = readFileSync(expectedPath, 'utf8').split('\n');
    assert.ok(want.length > 1000);
    const differ = [];
    for (let i = 0; i < Math.max(got.length, want.length); i++) {
      if (got[i] !== want[i]) differ.push(`line ${i + 1}\n  expected: ${want[i]}\n  computed: ${got[i]}`);
    }
    assert.equal(differ.length, 0, `${differ.length} lines differ:\n${differ.slice(0, 5).join('\n')}`);
  });

/* SPDX-License-Identifier: MIT */
// Runs a WASI command module (argv[2]) with node's WASI, its stdout to
// this process's stdout, and exits with its status. Kept apart so the test
// can start it with --experimental-wasi-unstable-preview1 on node 18,
// where node:wasi still needs that flag (node 20 does not).
import { readFileSync } from 'node:fs';
import { WASI } from 'node:wasi';

const wasi = new WASI({ version: 'preview1', args: ['refvectors'], env: {}, returnOnExit: true });
const mod = await WebAssembly.compile(readFileSync(process.argv[2]));
// getImportObject() since node 19.8; node 18 takes wasiImport.
const imports = wasi.getImportObject ? wasi.getImportObject() : { wasi_snapshot_preview1: wasi.wasiImport };
const inst = await WebAssembly.instantiate(mod, imports);
process.exitCode = wasi.start(inst);

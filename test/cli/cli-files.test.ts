// @vitest-environment node
/**
 * The command line's files: every read or write problem in words with exit 2, no file's
 * bytes echoed, an output never replacing an input, plantFile kept to the scenario's folder,
 * and the Node reader refusing folders, devices, huge and binary files.
 */
import { describe, it, expect, beforeEach, afterEach } from 'vitest';
import { chmodSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../electron/cli/run-cli';
import { nodeIO } from '../../electron/cli/node-io';
import { demoPlantJson } from '../helpers/plants';
import type { CliIO } from '../../electron/cli/io';

let dir: string;
let out = '';
let err = '';
const io: CliIO = { ...nodeIO, out: (t) => void (out += t), err: (t) => void (err += t) };

beforeEach(() => {
  dir = mkdtempSync(join(tmpdir(), 'droopline-cli-'));
  out = '';
  err = '';
});
afterEach(() => rmSync(dir, { recursive: true, force: true }));

const plantText = () => JSON.stringify(demoPlantJson());

describe('command-line files', () => {
  it('refuses --out naming the input file, leaving it untouched (exit 2)', async () => {
    const plant = join(dir, 'x.json');
    writeFileSync(plant, plantText());
    const code = await runCli(['report', plant, '--out', plant, '--date', '2026-12-02'], io);
    expect(code).toBe(2);
    expect(err).toContain(`--out: ${plant} is the input file; the report would replace it.`);
    expect(readFileSync(plant, 'utf8')).toBe(plantText());
    // The same file under another spelling is caught too.
    err = '';
    expect(await runCli(['report', plant, '--out', join(dir, '.', 'x.json'), '--date', '2026-12-02'], io)).toBe(2);
    expect(readFileSync(plant, 'utf8')).toBe(plantText());
  });

  it('says why a report could not be written, exit 2, no internal error', async () => {
    const plant = join(dir, 'plant.json');
    writeFileSync(plant, plantText());
    mkdirSync(join(dir, 'folder.html'));
    expect(await runCli(['report', plant, '--out', join(dir, 'folder.html'), '--date', '2026-12-02'], io)).toBe(2);
    expect(err).toContain('folder.html: is a folder, not a file');
    expect(err).not.toContain('internal error');
    err = '';
    expect(await runCli(['report', plant, '--out', join(dir, 'no', 'such', 'r.html'), '--date', '2026-12-02'], io)).toBe(2);
    expect(err).toContain('cannot write it: its folder does not exist');
  });

  it('writes the report atomically: no temporary file is left beside it', async () => {
    const plant = join(dir, 'plant.json');
    writeFileSync(plant, plantText());
    expect(await runCli(['report', plant, '--out', join(dir, 'r.html'), '--date', '2026-12-02'], io)).toBe(0);
    expect(readFileSync(join(dir, 'r.html'), 'utf8').startsWith('<!doctype html>')).toBe(true);
    const { readdirSync } = await import('node:fs');
    expect(readdirSync(dir).sort()).toEqual(['plant.json', 'r.html']);
  });

  it('tells a missing file, a folder, a device and a binary file apart, without echoing bytes', async () => {
    expect(await runCli(['describe', join(dir, 'gone.json')], io)).toBe(2);
    expect(err).toContain('gone.json: no such file');
    err = '';
    expect(await runCli(['describe', dir], io)).toBe(2);
    expect(err).toContain('is a folder, not a file');
    err = '';
    expect(await runCli(['describe', '/dev/zero'], io)).toBe(2);
    expect(err).toContain('/dev/zero: is not a regular file');
    err = '';
    const bin = join(dir, 'image.json');
    writeFileSync(bin, Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x00, 0x01, 0xff, 0xfe]));
    expect(await runCli(['describe', bin], io)).toBe(2);
    expect(err).toContain('image.json: is not a text file');
    expect(err).not.toContain('PNG');
  });

  it('says permission denied for a file it may not read', async () => {
    if (process.getuid?.() === 0) return; // root reads everything: nothing to check here
    const locked = join(dir, 'locked.json');
    writeFileSync(locked, plantText());
    chmodSync(locked, 0o000);
    expect(await runCli(['describe', locked], io)).toBe(2);
    expect(err).toContain('locked.json: cannot read it: permission denied');
  });

  it('names the line and column of bad JSON and never quotes the file', async () => {
    const f = join(dir, 'notes.json');
    writeFileSync(f, 'root:x:0:0:root:/root:/bin/bash\n');
    expect(await runCli(['describe', f], io)).toBe(2);
    expect(err).toContain('notes.json: not valid JSON at line 1, column 1');
    expect(err).not.toContain('/bin/bash');
  });

  it("keeps a scenario's plantFile inside the scenario's folder and never quotes a foreign file", async () => {
    mkdirSync(join(dir, 'study'));
    mkdirSync(join(dir, 'study', 'plants'));
    writeFileSync(join(dir, 'secret.json'), '{"apiToken": "abc123", "user": "x"}');
    writeFileSync(join(dir, 'study', 'plants', 'site.json'), plantText());
    const scenario = (plantFile: string) => JSON.stringify({ format: 'droopline.scenario', version: 1, plantFile, durationS: 1, stepMs: 2, events: [] });
    const file = join(dir, 'study', 's.json');
    for (const bad of ['../secret.json', '/etc/passwd', 'plants/../../secret.json']) {
      writeFileSync(file, scenario(bad));
      err = '';
      expect(await runCli(['simulate', file], io), bad).toBe(2);
      expect(err).toContain("plantFile: must name a file in the scenario's folder or below it");
    }
    writeFileSync(join(dir, 'study', 'foreign.json'), '{"apiToken": "abc123"}');
    writeFileSync(file, scenario('foreign.json'));
    err = '';
    expect(await runCli(['simulate', file], io)).toBe(2);
    expect(err).toContain('is not a Droopline plant file');
    expect(err).not.toContain('apiToken');
    writeFileSync(file, scenario('plants/site.json'));
    err = '';
    expect(await runCli(['simulate', file], io), err).toBe(0);
  });
});

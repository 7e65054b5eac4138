import { describe, it, expect } from 'vitest';
import { parseProject, serializeProject, ProjectFileError } from '../../electron/project';
import { dispatch } from '../../electron/handlers';
import { demoPlantJson, rawPlant, rawSet } from '../helpers/plants';
import { projectText, rawCommissioning, rawProject } from '../helpers/projects';

/** The error a parse throws (fails the test when it does not throw). */
function failure(text: string): ProjectFileError {
  try {
    parseProject(text);
  } catch (e) {
    if (e instanceof ProjectFileError) return e;
    throw e;
  }
  throw new Error('parseProject accepted the text');
}

describe('parseProject', () => {
  it('reads a current project and keeps every part', () => {
    const { project, migratedFrom, notes } = parseProject(projectText());
    expect(migratedFrom).toBeNull();
    expect(notes).toEqual([]);
    expect(project.name).toBe('Kestrel Ford study');
    expect(project.plant.sets.map((s) => s.id)).toEqual(['G1', 'G2', 'G3']);
    expect(project.scenarios[0]!.events[0]).toEqual({ atS: 2, type: 'motor-start', kVA: 400, pf: 0.3, durationS: 3 });
    expect(project.sync?.incomingSetId).toBe('G2');
    expect(project.trainerLog[0]!.score).toBe(86);
    expect(project.view).toEqual({ view: 'sharing' });
  });

  it('round-trips: save, open and save again give identical text and an identical project', () => {
    const first = parseProject(projectText()).project;
    const text = serializeProject(first);
    const second = parseProject(text).project;
    expect(second).toEqual(first);
    expect(serializeProject(second)).toBe(text);
  });

  it('keeps fields it does not know inside scenarios, events, sync settings and attempts', () => {
    const raw = rawProject();
    const scenarios = raw.scenarios as Record<string, unknown>[];
    scenarios[0] = { ...scenarios[0], outputPoints: 500, events: [{ atS: 1, type: 'load-step', kW: 200, kVAR: 90, note: 'kept' }] };
    const { project } = parseProject(JSON.stringify({ ...raw, scenarios }));
    const again = parseProject(serializeProject(project)).project;
    expect((again.scenarios[0] as unknown as Record<string, unknown>).outputPoints).toBe(500);
    expect((again.scenarios[0]!.events[0] as unknown as Record<string, unknown>).note).toBe('kept');
  });

  it('checks each scenario event by its type, as a scenario file is checked, and names the field; a stale id is a note, not a refusal', () => {
    const withEvents = (events: unknown[]) => {
      const raw = rawProject();
      const scenarios = raw.scenarios as Record<string, unknown>[];
      scenarios[0] = { ...scenarios[0], durationS: 10, events };
      return JSON.stringify({ ...raw, scenarios });
    };
    // A null field used to open and save, then fail only when the scenario ran.
    expect(failure(withEvents([{ atS: 1, type: 'load-step', kW: null, kVAR: 10 }])).message).toContain('scenarios[0].events[0].kW');
    expect(failure(withEvents([{ atS: null, type: 'trip', setId: 'G1' }])).message).toContain('scenarios[0].events[0].atS');
    expect(failure(withEvents([{ atS: 1, type: 'explode' }])).message).toContain('must be "load-step"');
    // An event that no longer fits the plant (a set deleted since) does not lock the user out: the
    // project opens and a note says which event will be refused when its scenario runs.
    const notesOf = (events: unknown[]) => parseProject(withEvents(events)).notes.join(' ');
    expect(notesOf([{ atS: 1, type: 'trip', setId: 'G9' }])).toContain('event 1 (setId): no set "G9" in the plant');
    expect(notesOf([{ atS: 11, type: 'trip', setId: 'G1' }])).toContain('must be within the run (0 to 10 s)');
    expect(notesOf([{ atS: 1, type: 'load-step', loadId: 'nowhere' }])).toContain('no load "nowhere" in the plant');
    // A valid event opens.
    expect(parseProject(withEvents([{ atS: 1, type: 'trip', setId: 'G1' }])).notes).toEqual([]);
  });

  it('fills the parts a minimal project leaves out', () => {
    const { project } = parseProject(JSON.stringify({ format: 'droopline.project', version: 1, plant: demoPlantJson() }));
    expect(project.name).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(project.scenarios).toEqual([]);
    expect(project.sync).toBeNull();
    expect(project.trainerLog).toEqual([]);
    expect(project.view).toEqual({});
  });

  describe('the commissioning section', () => {
    const withSection = (section: unknown) => JSON.stringify(rawProject({ commissioning: section }));

    it('round-trips: the record with its choices, the test (a blank kept as null), the parameter choice, the fit and the sign-off', () => {
      const { project, notes } = parseProject(withSection(rawCommissioning()));
      expect(notes).toEqual([]);
      expect(project.commissioning).toEqual(rawCommissioning());
      const text = serializeProject(project);
      const again = parseProject(text);
      expect(again.project).toEqual(project);
      expect(again.notes).toEqual([]);
      expect(serializeProject(again.project)).toBe(text);
    });

    it('is absent from a project saved before it was kept, which opens as before (and null reads as absent)', () => {
      const old = parseProject(projectText());
      expect(old.notes).toEqual([]);
      expect('commissioning' in old.project).toBe(false);
      expect(serializeProject(old.project)).not.toContain('commissioning');
      expect('commissioning' in parseProject(withSection(null)).project).toBe(false);
    });

    it('keeps fields it does not know, and every part may be left out', () => {
      const section: Record<string, unknown> = { ...rawCommissioning(), lastView: 'fit' };
      (section.record as Record<string, unknown>).encoding = 'utf-8';
      const { project } = parseProject(withSection(section));
      expect((project.commissioning as Record<string, unknown>).lastView).toBe('fit');
      expect((project.commissioning!.record as Record<string, unknown>).encoding).toBe('utf-8');
      const partial = parseProject(withSection({ signOff: { by: 'A', date: '', remarks: '' } }));
      expect(partial.notes).toEqual([]);
      expect(partial.project.commissioning).toEqual({ signOff: { by: 'A', date: '', remarks: '' } });
    });

    it('leaves out a damaged part with a note naming the field and the rule; the rest of the section and the project open', () => {
      const section = rawCommissioning();
      (section.test as Record<string, unknown>).stepAtS = 'two';
      (section.fit as { result: { residual: Record<string, unknown> } }).result.residual.totalPct = 'small';
      const { project, notes } = parseProject(withSection(section));
      expect(notes).toHaveLength(2);
      expect(notes[0]).toContain(
        'Commissioning: the test description was left out (test step time: must be a number or null (blank) [commissioning.test.stepAtS])',
      );
      expect(notes[1]).toContain(
        'the fit result was left out (fit result RMS error both together: must be a number [commissioning.fit.result.residual.totalPct])',
      );
      expect(notes[1]).toContain('saving writes it without that part');
      const c = project.commissioning!;
      expect(c.test).toBeUndefined();
      expect(c.fit).toBeUndefined();
      // Nothing else is lost: the record, the parameter choice and the sign-off, and the project's other parts.
      expect(c.record).toEqual(rawCommissioning().record);
      expect(c.params).toEqual(rawCommissioning().params);
      expect(c.signOff).toEqual(rawCommissioning().signOff);
      expect(project.scenarios).toHaveLength(1);
      expect(project.sync?.incomingSetId).toBe('G2');
    });

    it("names the record's fields: a column, a unit and text that is not text", () => {
      const section = rawCommissioning();
      const record = section.record as Record<string, Record<string, unknown>>;
      record.columns!.time = true;
      record.units!.voltage = 'volts';
      const { notes } = parseProject(withSection(section));
      expect(notes.join(' ')).toContain('test record column of time: must be a column name or a column number (1, 2, …) [commissioning.record.columns.time]');
      expect(notes.join(' ')).toContain('test record unit of voltage: must be "V", "kV", "pu" or "%" [commissioning.record.units.voltage]');
      const notText = parseProject(withSection({ ...rawCommissioning(), record: { ...(rawCommissioning().record as object), text: 42 } }));
      expect(notText.notes.join(' ')).toContain('must be text [commissioning.record.text]');
      expect(notText.project.commissioning!.record).toBeUndefined();
    });

    it('leaves out a section that is not an object, saying so', () => {
      for (const bad of [7, 'fit', [rawCommissioning()]]) {
        const { project, notes } = parseProject(withSection(bad));
        expect(notes).toEqual([expect.stringContaining('The commissioning work was left out (commissioning: must be an object)')]);
        expect('commissioning' in project).toBe(false);
        expect(project.trainerLog).toHaveLength(1);
      }
    });
  });

  it('opens a project saved before exercise sets existed with none, and keeps a set through save and open', () => {
    const old = rawProject();
    expect(old.trainerExercises).toBeUndefined();
    expect(parseProject(JSON.stringify(old)).project.trainerExercises).toEqual([]);
    const set = {
      id: 'set-1',
      name: 'Night shift, week 2',
      exercises: [
        {
          id: 'ex-1',
          name: 'Slow breaker',
          levelId: 'slow-breaker',
          seed: 41,
          faults: { breakerSlowMs: 150 },
          pass: { minScore: 70, insideWindow: true, withinMachineLimits: true },
        },
        {
          id: 'ex-2',
          name: 'Dead bus',
          levelId: 'steady',
          seed: 7,
          faults: { deadBus: true, voltageMismatchPct: -6 },
          pass: { minScore: 60, insideWindow: true, withinMachineLimits: false },
        },
      ],
    };
    const { project } = parseProject(JSON.stringify({ ...old, trainerExercises: [set] }));
    expect(project.trainerExercises).toEqual([set]);
    expect(parseProject(serializeProject(project)).project.trainerExercises).toEqual([set]);
  });

  it('refuses an exercise set with a fault out of range or an unknown level, naming the field', () => {
    const bad = {
      id: 'set-1',
      name: 'x',
      exercises: [
        {
          id: 'ex-1',
          name: 'x',
          levelId: 'nightmare',
          seed: 1,
          faults: { breakerSlowMs: -1 },
          pass: { minScore: 70, insideWindow: true, withinMachineLimits: true },
        },
      ],
    };
    const e = failure(projectText({ trainerExercises: [bad] }));
    expect(e.issues).toContainEqual({ path: 'trainerExercises[0].exercises[0].levelId', message: 'must be one of the trainer levels' });
    expect(e.issues).toContainEqual({ path: 'trainerExercises[0].exercises[0].faults.breakerSlowMs', message: 'must be 0 or more' });
  });

  it('ignores a byte-order mark at the start', () => {
    expect(parseProject(`\uFEFF${projectText()}`).project.name).toBe('Kestrel Ford study');
  });

  it('migrates a version-1 plant file into a new project around it', () => {
    const plantText = JSON.stringify(demoPlantJson());
    const { project, migratedFrom, notes } = parseProject(plantText);
    expect(migratedFrom).toBe('a plant file, version 1');
    expect(notes[0]).toContain('plant file is not changed');
    expect(project.format).toBe('droopline.project');
    expect(project.version).toBe(1);
    expect(project.name).toBe('Kestrel Ford Water Treatment Works (demo)');
    expect(project.plant.sets[0]!.governor.noLoadHz).toBe(51.2);
    expect(project.scenarios).toEqual([]);
    expect(project.sync).toBeNull();
    expect(project.trainerLog).toEqual([]);
  });

  it('migrates a scenario file into a project with its plant and the scenario', () => {
    const text = JSON.stringify({
      format: 'droopline.scenario',
      version: 1,
      name: 'Trip G3',
      plant: demoPlantJson(),
      durationS: 10,
      outputPoints: 800,
      events: [{ atS: 1, type: 'trip', setId: 'G3' }],
    });
    const { project, migratedFrom } = parseProject(text);
    expect(migratedFrom).toBe('a scenario file, version 1');
    expect(project.scenarios).toEqual([
      { id: 'S1', name: 'Trip G3', durationS: 10, stepMs: 1, outputPoints: 800, events: [{ atS: 1, type: 'trip', setId: 'G3' }] },
    ]);
  });

  it('names each field problem of the plant inside a project by its path and rule', () => {
    const plant = rawPlant([rawSet('G1'), rawSet('G2', { governor: { mode: 'droop', droopPct: -1, noLoadHz: 52 } })]);
    const e = failure(projectText({ plant }));
    expect(e.problem).toBe('invalid');
    expect(e.issues).toContainEqual({ path: 'plant.sets[1].governor.droopPct', message: 'must be 0 or more' });
    expect(e.message).toContain('plant.sets[1].governor.droopPct: must be 0 or more');
    expect(e.message).toContain('the file was not changed');
  });

  it('names problems in the parts around the plant', () => {
    const e = failure(projectText({ scenarios: [{ id: 'S1', name: 'x', durationS: 0, stepMs: 1, events: [] }], trainerLog: 'none' }));
    expect(e.message).toContain('scenarios[0].durationS: must be greater than 0');
    expect(e.message).toContain('trainerLog: must be a list');
    const dup = failure(
      projectText({
        scenarios: [
          { id: 'A', name: 'a', durationS: 1, stepMs: 1, events: [] },
          { id: 'A', name: 'b', durationS: 1, stepMs: 1, events: [] },
        ],
      }),
    );
    expect(dup.message).toContain('scenarios[1].id: must be unique ("A" is used twice)');
    expect(failure(projectText({ colour: 'teal' })).message).toContain('(root): unknown field(s): colour');
  });

  it('refuses a project from a newer version with a clear message', () => {
    const e = failure(projectText({ version: 2 }));
    expect(e.problem).toBe('newer');
    expect(e.message).toBe(
      'This project was saved by a newer version of Droopline (file version 2; this version reads up to 1). Open it with a newer Droopline. The file was not changed.',
    );
    expect(failure(JSON.stringify({ ...(demoPlantJson() as object), version: 3 })).message).toContain(
      'This plant file was saved by a newer version of Droopline (file version 3',
    );
  });

  it('refuses foreign JSON and other files naming what they are', () => {
    expect(failure('{"name":"left-pad","version":"1.3.0"}').message).toContain('it has no "format" field');
    expect(failure('{"format":"chart.layout","version":1}').message).toContain('This is a "chart.layout" file, not a Droopline project');
    expect(failure('[1, 2, 3]').message).toContain('This file holds JSON (a list) but not a Droopline project');
    expect(failure('"text"').problem).toBe('not-a-project');
    expect(failure('{"format":"droopline.sync","version":1,"limits":{}}').message).toContain('sync-check case without a plant');
    expect(failure(projectText({ version: 1.5 })).message).toContain('version: must be a whole number of 1 or more');
  });

  it('says a truncated file was cut short, with line and column', () => {
    const full = projectText();
    const cut = full.slice(0, Math.floor(full.length * 0.6));
    const e = failure(cut);
    expect(e.problem).toBe('truncated');
    expect(e.message).toMatch(/^The file stops in the middle of the project \(line \d+, column \d+, where .+ should follow\): it was cut short/);
    expect(e.message).toContain('The file was not changed.');
    expect(failure('{"format": "droopline.project", "name": "ab').problem).toBe('truncated');
  });

  it('says where a damaged file breaks', () => {
    const e = failure('{\n  "format": "droopline.project",\n  "version": 1 x\n}');
    expect(e.problem).toBe('corrupted');
    // The JSON reader (jsonc-parser) asks for the ',' between members here; it does not name the closing brace as well.
    expect(e.message).toBe('The file is damaged: it is not valid JSON (line 3, column 16: expected \',\', found "x"). The file was not changed.');
  });

  it('recognises empty files and files of zero bytes left by a power loss', () => {
    expect(failure('').problem).toBe('empty');
    expect(failure('  \n').message).toBe('The file is empty: it holds no project. The file was not changed.');
    expect(failure('\u0000'.repeat(4096)).problem).toBe('binary');
  });

  it('is reachable through the engine method parseProject, errors as plain objects', async () => {
    const ok = await dispatch('parseProject', { text: projectText() });
    expect(ok.ok && ok.value.project.name).toBe('Kestrel Ford study');
    const bad = await dispatch('parseProject', { text: '{"format": "droopline.project"' });
    expect(bad.ok).toBe(false);
    if (!bad.ok) {
      expect(bad.error.code).toBe('INVALID_INPUT');
      expect(bad.error.message).toContain('cut short');
    }
    const notText = await dispatch('parseProject', { text: 42 });
    expect(!notText.ok && notText.error.message).toBe('text: must be text');
  });
});

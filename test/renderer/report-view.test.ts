import { describe, it, expect, beforeEach, vi } from 'vitest';
import { mount, flushPromises } from '@vue/test-utils';
import ReportView from '../../renderer/views/ReportView.vue';
import { usePlantStore } from '../../renderer/stores/plant';
import { parseLoads, useReportStore } from '../../renderer/stores/report';
import { useTransientsStore } from '../../renderer/stores/transients';
import { dispatch } from '../../electron/handlers';
import type { ReportResult } from '../../shared-types';
import { freshStores } from './view-harness';

describe('ReportView', () => {
  beforeEach(async () => {
    freshStores();
    await usePlantStore().loadDemo();
  });

  it('reads the load list and names the wrong entry', () => {
    expect(parseLoads('25, 50 75;100%')).toEqual({ loads: [25, 50, 75, 100], problem: null });
    expect(parseLoads('25, x').problem).toBe('loads[1]: "x" is not a number');
    expect(parseLoads('0').problem).toBe('loads[0]: must be greater than 0 and at most 200 %');
    expect(parseLoads(' ').problem).toContain('list at least one load');
  });

  it('turns Build off and lists the problem for a bad load list', async () => {
    const w = mount(ReportView);
    await w.get('[data-test="report-loads"]').setValue('25, fifty');
    expect(w.get('[data-test="report-problems"]').text()).toContain('loads[1]: "fifty" is not a number');
    expect(w.get('[data-test="report-build"]').attributes('disabled')).toBeDefined();
  });

  it('refuses an unreadable or out-of-rule power factor beside the field, keeps the last good one and turns Build off', async () => {
    const store = useReportStore();
    store.date = '2026-12-02';
    const w = mount(ReportView, { attachTo: document.body });
    const pf = w.get('[data-test="report-pf"]');
    expect(pf.attributes('type')).toBe('text');
    await pf.setValue('abc');
    expect(store.loadPF).toBe(0.8); // the last good value stays in the store
    expect(w.get('[data-test="error-report-pf"]').text()).toBe('load power factor must be a number');
    expect((pf.element as HTMLInputElement).value).toBe('abc');
    expect(w.get('[data-test="report-build"]').attributes('disabled')).toBeDefined();
    expect(w.get('[data-test="report-problems"]').text()).toContain('Correct the marked field first: load power factor must be a number.');
    // Power factor is above 0 and at most 1 (closed form: cos φ; the engine's report request holds the same rule).
    await pf.setValue('1.05');
    expect(store.loadPF).toBe(0.8);
    expect(w.get('[data-test="error-report-pf"]').text()).toBe('load power factor must be above 0 and at most 1');
    await pf.setValue('0.9');
    expect(store.loadPF).toBe(0.9);
    expect(w.find('[data-test="error-report-pf"]').exists()).toBe(false);
    expect(w.find('[data-test="report-problems"]').exists()).toBe(false);
    expect(w.get('[data-test="report-build"]').attributes('disabled')).toBeUndefined();
    w.unmount();
  });

  it('builds the same report as the engine from the plant, the scenarios and the sync settings', async () => {
    const transients = useTransientsStore();
    transients.restore([{ id: 'q', name: 'Quick step', durationS: 2, stepMs: 2, events: [{ atS: 0.5, type: 'load-step', kW: 100, kVAR: 60 }] }]);
    const store = useReportStore();
    store.date = '2026-12-02';
    store.loadsText = '40, 80';
    const w = mount(ReportView);
    await w.get('form').trigger('submit');
    await vi.waitFor(() => expect(store.building).toBe(false), { timeout: 15_000, interval: 50 });
    await flushPromises();
    expect(store.error).toBeNull();
    const got = store.result!;
    const direct = await dispatch('buildReport', store.request());
    if (!direct.ok) throw new Error(direct.error.message);
    expect(got.html).toBe((direct.value as ReportResult).html);
    expect(got.html).toContain('Quick step');
    expect(got.tables.find((t) => t.id === 'sharing-bus')!.rows.map((r) => r[0])).toEqual(['connected load', '40 %', '80 %', 'overload limit (110 %)']);
    const list = w.get('[data-test="report-sections"]').text();
    expect(list).toContain('Transient metrics and ISO 8528-5 classes');
    expect(w.findAll('[data-test^="report-csv-"]').length).toBe(got.tables.length);
    expect(w.findAll('[data-test^="report-png-"]').length).toBe(got.charts.length);
  });
});

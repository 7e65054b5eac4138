import { describe, it, expect } from 'vitest';
import { mount } from '@vue/test-utils';
import NumberInput from '../../renderer/components/common/NumberInput.vue';

type Props = InstanceType<typeof NumberInput>['$props'];
const make = (props: Partial<Props> = {}) => mount(NumberInput, { props: { value: 0.1, testId: 'f', ...props } as Props, attachTo: document.body });
const input = (w: ReturnType<typeof make>) => w.get('input').element as HTMLInputElement;

describe('NumberInput, the one number input of every view', () => {
  it('sends each keystroke as a number (null when blank or unreadable) and says when focus leaves', async () => {
    const w = make({ value: 4, label: 'Droop, %' });
    await w.get('input').trigger('focus');
    await w.get('input').setValue('4.');
    await w.get('input').setValue('4.5');
    await w.get('input').setValue('');
    await w.get('input').setValue('4,5 ');
    await w.get('input').setValue('abc');
    expect(w.emitted('input')!.map((e) => e[0])).toEqual([4, 4.5, null, 4.5, null]);
    await w.get('input').trigger('blur');
    expect(w.emitted('done')).toHaveLength(1);
    expect(input(w).getAttribute('aria-label')).toBe('Droop, %');
    w.unmount();
  });

  it('commits on change: the number, or NaN for blank or unreadable text (the engine then says "must be a number")', async () => {
    const w = make();
    await w.get('input').setValue('0.25');
    await w.get('input').setValue('');
    await w.get('input').setValue('x1');
    await w.get('input').setValue('−0,2');
    const commits = w.emitted('commit')!.map((e) => e[0] as number);
    expect(commits[0]).toBe(0.25);
    expect(Number.isNaN(commits[1])).toBe(true);
    expect(Number.isNaN(commits[2])).toBe(true);
    expect(commits[3]).toBe(-0.2);
    w.unmount();
  });

  it('keeps a refused number on show beside the reason, which names the field and the rule, until the value changes', async () => {
    const w = make({ value: 0.1, name: 'slip limit', unit: 'Hz', issueTest: 'error-slip', issueKey: 'limits.slipHz' });
    expect(w.get('.unit').text()).toBe('Hz');
    expect(w.find('[data-test="error-slip"]').exists()).toBe(false);
    await w.get('input').trigger('focus');
    await w.get('input').setValue('-0.2');
    await w.get('input').trigger('blur');
    // The store refuses it: the value stays 0.1 and the rule comes back.
    await w.setProps({ issue: 'must be greater than 0' });
    expect(input(w).value).toBe('-0.2');
    expect(w.get('[data-test="error-slip"]').text()).toContain('slip limit must be greater than 0');
    expect(input(w).getAttribute('aria-invalid')).toBe('true');
    expect(input(w).getAttribute('aria-describedby')).toBe('issue-limits-slipHz');
    expect(w.get('#issue-limits-slipHz').text()).toContain('slip limit must be greater than 0');
    // Put right: the store takes 0.2 and the field shows its value.
    await w.get('input').setValue('0.2');
    await w.setProps({ value: 0.2, issue: undefined });
    expect(input(w).value).toBe('0.2');
    expect(input(w).getAttribute('aria-invalid')).toBe(null);
    await w.setProps({ value: 0.3 });
    expect(input(w).value).toBe('0.3');
    w.unmount();
  });

  it('keeps unreadable text after the field loses focus (never wiped), and blank text as blank', async () => {
    const w = make({ value: 5 });
    await w.get('input').trigger('focus');
    await w.get('input').setValue('5..');
    await w.get('input').trigger('blur');
    await w.setProps({ value: null, issue: 'must be a number' });
    expect(input(w).value).toBe('5..');
    expect(w.get('[data-test="field-issue"]').text()).toContain('must be a number');
    w.unmount();
  });

  it('does not rewrite the text under the cursor when the view re-renders with the same value', async () => {
    const w = make({ value: 4 });
    await w.get('input').trigger('focus');
    await w.get('input').setValue('4.');
    await w.setProps({ value: 4, unit: 'Hz' });
    expect(input(w).value).toBe('4.');
    w.unmount();
  });

  it('shows the value to the given digits and nothing for a number that is not finite', async () => {
    const w = make({ value: -73.4567, digits: 1 });
    expect(input(w).value).toBe('-73.5');
    await w.setProps({ value: Number.NaN });
    expect(input(w).value).toBe('');
    w.unmount();
  });

  it('steps with Up and Down by its step, never below its minimum, and commits each step', async () => {
    const w = make({ value: 0.1, step: 0.05, min: 0 });
    await w.get('input').trigger('focus');
    await w.get('input').trigger('keydown', { key: 'ArrowUp' });
    expect(input(w).value).toBe('0.15');
    await w.get('input').trigger('keydown', { key: 'ArrowDown' });
    await w.get('input').trigger('keydown', { key: 'ArrowDown' });
    await w.get('input').trigger('keydown', { key: 'ArrowDown' });
    await w.get('input').trigger('keydown', { key: 'ArrowDown' });
    expect(w.emitted('commit')!.map((e) => e[0])).toEqual([0.15, 0.1, 0.05, 0, 0]);
    expect(input(w).value).toBe('0');
    w.unmount();
  });

  it('leaves the arrows alone without a step, and passes attributes such as disabled to the input', async () => {
    const w = mount(NumberInput, { props: { value: 3, testId: 'f' }, attrs: { disabled: true }, attachTo: document.body });
    await w.get('input').trigger('keydown', { key: 'ArrowUp' });
    expect(w.emitted('commit')).toBeUndefined();
    expect(input(w).disabled).toBe(true);
    expect(input(w).getAttribute('data-test')).toBe('f');
    w.unmount();
  });

  it('dims a field the mode does not use and says why in its title', () => {
    const w = make({ value: 2, label: 'Reset, s', unused: 'isochronous mode' });
    expect(w.get('.field').classes()).toContain('unused');
    expect(input(w).title).toBe('Reset, s: not used now (isochronous mode)');
    w.unmount();
  });
});

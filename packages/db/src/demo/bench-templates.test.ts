import { describe, expect, it } from 'vitest';
import { benchTemplateInput } from '@bumperline/contracts/bench-jobs';
import { cautionKinds } from '@bumperline/contracts/bench-vocabulary';
import { demoTemplates, powerSupplyRecapTemplate } from './bench-templates.ts';

describe('the demo bench-job templates', () => {
  it.each(demoTemplates.map((t) => [t.name, t] as const))('%s is a template the API would save', (_name, template) => {
    const parsed = benchTemplateInput.safeParse(template);
    expect(parsed.success, JSON.stringify(parsed.error?.issues)).toBe(true);
  });

  it('puts every soldering and mains step behind its cautions', () => {
    const byKey = new Map(powerSupplyRecapTemplate.steps.map((s) => [s.key, s]));
    expect(byKey.get('unplug')!.cautions).toEqual(['mains']);
    expect(byKey.get('discharge')!.cautions).toEqual(['charged_capacitors']);
    for (const key of ['rectifiers', 'connectors', 'reflow', 'recap']) {
      expect(byKey.get(key)!.cautions, key).toEqual(['hot_iron', 'solder_fumes', 'leaded_solder']);
    }
    // Steps run with the supply switched on carry the live-work caution, not the unplug-first one.
    expect(byKey.get('power-up')!.cautions).toEqual(['live_work']);
    expect(byKey.get('load-resistors')!.cautions).toEqual(['live_work']);
    // Nothing names a caution the bench does not know.
    for (const step of powerSupplyRecapTemplate.steps) for (const c of step.cautions) expect(cautionKinds).toContain(c);
  });

  it('has exactly one step that counts as the recap (electrolytics replaced)', () => {
    const recapSteps = powerSupplyRecapTemplate.steps.filter(
      (s) => s.partKinds.includes('electrolytic') && (s.record === 'parts_used' || s.record === 'check'),
    );
    expect(recapSteps.map((s) => s.key)).toEqual(['recap']);
  });
});

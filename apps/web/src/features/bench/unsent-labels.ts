// Says in words where each left-over value belongs: "Measure the resistors · R12 reading".
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { BRIDGE_READING_KEYS, DIODE_READING_KEYS } from '@bumperline/domain/components/bench-judgement';
import type { UnsentChange } from './unsent-changes.ts';

const legLabels = new Map<string, string>([...DIODE_READING_KEYS, ...BRIDGE_READING_KEYS].map((k) => [k.key, k.label]));

export function unsentLabel(change: UnsentChange, steps: readonly BenchStep[], designatorOf: (partId: string) => string): string {
  const step = change.stepKey ? (steps.find((s) => s.key === change.stepKey)?.title ?? change.stepKey) : 'Parts used';
  const part = change.partId ? designatorOf(change.partId) : '';
  const what: Record<UnsentChange['what'], string> = {
    done: 'Done',
    acknowledged: 'I have read the cautions',
    answer: 'answer',
    note: 'note',
    reading: `${part} reading`,
    inCircuit: `${part} in circuit`,
    diode: `${part} ${change.leg ? (legLabels.get(change.leg) ?? change.leg) : ''}`.trim(),
    fitted: `${part} fuse fitted`,
    volts: `${part} volts across it`,
    partUsed: 'part',
  };
  return `${step} · ${what[change.what]}`;
}

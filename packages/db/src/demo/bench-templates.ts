// The demo company's bench-job templates: a power-supply recap and reflow in the order a bench works through it
// (safe first, then inspect, replace, measure, power up), and a shorter sound-board reflow. Also one job in
// progress on a Comet Carnival power supply, part-way through, to show a job resumed where it was left.
import { and, eq } from 'drizzle-orm';
import type { BenchJobDraft, BenchStep, BenchStepProgress } from '@bumperline/contracts/bench-vocabulary';
import type { Tx } from '../client.ts';
import { benchJobs, benchTemplates, boardParts } from '../schema/index.ts';
import type { DemoBoardInstance } from './boards.ts';

export interface DemoTemplate {
  name: string;
  description: string;
  steps: BenchStep[];
}

const IRON = ['hot_iron', 'solder_fumes', 'leaded_solder'] as const;

const step = (s: Partial<BenchStep> & Pick<BenchStep, 'key' | 'title' | 'instructions' | 'record'>): BenchStep => ({
  partKinds: [],
  designators: [],
  cautions: [],
  ...s,
});

const unplug = step({
  key: 'unplug',
  title: 'Unplug and verify dead',
  instructions:
    'Switch the game off, pull the plug and keep it in sight. Open the power supply only then, and check with the meter ' +
    '(proven on a live socket first) that there is no voltage on the mains input terminals.',
  record: 'check',
  cautions: ['mains'],
});

const discharge = step({
  key: 'discharge',
  title: 'Discharge the filter capacitors',
  instructions:
    'Discharge each large filter capacitor through a 100 Ω 5 W resistor held in insulated clips, then read 0 V across it ' +
    'before touching the board. Start with the highest-voltage rail.',
  record: 'check',
  cautions: ['charged_capacitors'],
});

const inspect = step({
  key: 'inspect',
  title: 'Inspect for heat damage and earlier repairs',
  instructions:
    'Look at the board front and back under a bright light: browned board around power resistors and rectifiers, ' +
    'cracked rings around header pins, bulging or leaking capacitors, lifted pads, and earlier repairs (jumper ' +
    'wires, wrong values, acid flux left behind). Note what you find.',
  record: 'check',
});

export const powerSupplyRecapTemplate: DemoTemplate = {
  name: 'Power supply recap and reflow',
  description:
    'Full overhaul of a game power supply: fuses checked against the parts list, rectifiers and diodes replaced and ' +
    'mounted raised, discoloured header pins replaced, cracked joints reflowed, every electrolytic replaced, resistors ' +
    'measured, then powered up on the bench and the outputs checked.',
  steps: [
    unplug,
    discharge,
    inspect,
    step({
      key: 'fuses',
      title: 'Check the fuses',
      instructions:
        'Read the marking on each fuse fitted and type it as printed. A replacement must match the current, the voltage ' +
        'and the speed (T time-lag or F quick-acting) the parts list gives; an earlier owner’s “bigger fuse” is replaced.',
      record: 'fuse',
      partKinds: ['fuse'],
    }),
    step({
      key: 'rectifiers',
      title: 'Replace bridge rectifiers and diodes, mounted raised',
      instructions:
        'Diode-test each bridge rectifier leg and each diode in both directions before and after replacing it. Fit the new ' +
        'parts raised a few millimetres off the board so air flows under them; a bridge on the heat sink gets fresh compound.',
      record: 'diode_set',
      partKinds: ['diode', 'bridge_rectifier'],
      cautions: [...IRON],
    }),
    step({
      key: 'connectors',
      title: 'Replace header pins and connectors',
      instructions:
        'Replace every discoloured or loose header with new pins, and the mating housing and crimp terminals on the ' +
        'harness at the same time: a new header in a burnt housing burns again. List the parts used.',
      record: 'parts_used',
      partKinds: ['connector'],
      cautions: [...IRON],
    }),
    step({
      key: 'reflow',
      title: 'Reflow cracked joints',
      instructions:
        'Reflow the joints of the heavy parts (headers, rectifiers, power resistors, regulators) with fresh solder and ' +
        'flux: remove the old solder first where it is dull or ringed. Clean the flux off afterwards.',
      record: 'check',
      cautions: [...IRON],
    }),
    step({
      key: 'recap',
      title: 'Recap',
      instructions:
        'Replace every electrolytic on the parts list with one of the same capacitance, at least the same voltage and a ' +
        '105 °C rating. Mind the polarity marking on the board. List the capacitors fitted.',
      record: 'parts_used',
      partKinds: ['electrolytic'],
      cautions: [...IRON],
    }),
    step({
      key: 'measure-resistors',
      title: 'Measure the resistors',
      instructions:
        'Read each resistor with the supply unplugged. Out of circuit is exact; in circuit, parallel parts can only read ' +
        'lower, so a low in-circuit reading is a hint: lift one leg and measure again before replacing it.',
      record: 'readings',
      partKinds: ['resistor'],
    }),
    step({
      key: 'power-up',
      title: 'Power up and check the outputs',
      instructions:
        'With the supply on the bench, connected to its load or a dummy load, switch on through a lamp limiter and read ' +
        'each output at the far end of the harness. Note the voltages read (e.g. +5.02 V, +12.1 V, 50.4 V).',
      record: 'check',
      cautions: ['live_work'],
    }),
    step({
      key: 'load-resistors',
      title: 'Power check of the load resistors',
      instructions:
        'With the supply running under load, read the voltage across each load and bleeder resistor. The check compares ' +
        'what it dissipates with its wattage at half its rating.',
      record: 'power',
      designators: ['R7', 'R8', 'R12'],
      cautions: ['live_work'],
    }),
    step({
      key: 'photo',
      title: 'Photo of the finished board',
      instructions: 'Photograph the component side of the finished board, square on, with the serial label readable.',
      record: 'photo',
    }),
  ],
};

export const soundBoardReflowTemplate: DemoTemplate = {
  name: 'Sound board reflow',
  description: 'Reflow of a sound board that crackles, drops out or hums: headers and amplifier joints, resistors measured.',
  steps: [
    unplug,
    inspect,
    step({
      key: 'reflow',
      title: 'Reflow headers and amplifier joints',
      instructions: 'Reflow the header pins and the amplifier and regulator joints with fresh solder and flux. Clean the flux off.',
      record: 'check',
      cautions: [...IRON],
    }),
    step({
      key: 'connectors',
      title: 'Replace worn connectors',
      instructions: 'Replace any header whose pins are discoloured or loose, with its mating housing. List the parts used.',
      record: 'parts_used',
      partKinds: ['connector'],
      cautions: [...IRON],
    }),
    step({
      key: 'measure-resistors',
      title: 'Measure the resistors',
      instructions: 'Read each resistor with the board unplugged; lift one leg of any that reads low in circuit.',
      record: 'readings',
      partKinds: ['resistor'],
    }),
    step({
      key: 'power-up',
      title: 'Power up and listen',
      instructions: 'Refit the board, switch on and run the sound test: no crackle when the harness is flexed, no hum.',
      record: 'check',
      cautions: ['live_work'],
    }),
  ],
};

export const demoTemplates: readonly DemoTemplate[] = [powerSupplyRecapTemplate, soundBoardReflowTemplate];

const fresh = (): BenchStepProgress => ({
  done: false,
  acknowledged: false,
  answer: null,
  note: '',
  readings: {},
  diodes: {},
  fuses: {},
  power: {},
});

/** The demo templates, and a recap-and-reflow job left part-way on the first power supply fitted in a game. */
export async function seedBenchTemplates(
  tx: Tx,
  ctx: { tenantId: string; fitted: readonly DemoBoardInstance[]; technicianIds: readonly string[] },
): Promise<void> {
  const ids = await tx
    .insert(benchTemplates)
    .values(demoTemplates.map((t) => ({ ...t, tenantId: ctx.tenantId })))
    .returning({ id: benchTemplates.id, name: benchTemplates.name });
  const recap = ids.find((t) => t.name === powerSupplyRecapTemplate.name)!;

  // The first fitted board whose parts list has a fuse and resistors is a power supply.
  for (const board of ctx.fitted) {
    const parts = await tx
      .select({ id: boardParts.id, designator: boardParts.designator, kind: boardParts.kind })
      .from(boardParts)
      .where(and(eq(boardParts.tenantId, ctx.tenantId), eq(boardParts.boardId, board.boardId)));
    const byDesignator = new Map(parts.map((p) => [p.designator, p.id]));
    const f1 = byDesignator.get('F1');
    const r1 = byDesignator.get('R1');
    const r2 = byDesignator.get('R2');
    if (!f1 || !r1 || !r2) continue;
    const steps = powerSupplyRecapTemplate.steps;
    const draft: BenchJobDraft = { steps: Object.fromEntries(steps.map((s) => [s.key, fresh()])), partsUsed: [] };
    draft.steps.unplug = { ...fresh(), done: true, acknowledged: true, answer: 'yes' };
    draft.steps.discharge = { ...fresh(), done: true, acknowledged: true, answer: 'yes', note: 'C1 held 3 V after an hour unplugged.' };
    draft.steps.inspect = {
      ...fresh(),
      done: true,
      answer: 'yes',
      note: 'Board browned under R12; J2 pins dark; an earlier repair left acid flux near BR1.',
    };
    draft.steps.fuses = { ...fresh(), fuses: { [f1]: { fitted: 'T2.5A 250V' } } };
    // Typed but not finished: the second reading was still being taken when the technician was called away.
    draft.steps['measure-resistors'] = {
      ...fresh(),
      readings: { [r1]: { text: '4.63k', inCircuit: true }, [r2]: { text: '4k', inCircuit: true } },
    };
    await tx.insert(benchJobs).values({
      tenantId: ctx.tenantId,
      boardInstanceId: board.id,
      templateId: recap.id,
      templateName: powerSupplyRecapTemplate.name,
      steps,
      origin: 'game',
      draft,
      version: 7,
      openedBy: ctx.technicianIds[0] ?? null,
      openedAt: new Date(Date.now() - 26 * 3600_000),
    });
    return;
  }
}

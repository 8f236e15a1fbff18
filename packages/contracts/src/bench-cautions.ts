// The usual cautions for bench work, shown on every step that involves the hazard and acknowledged before the
// step can be ticked. Sources: OSHA 29 CFR 1910.333 (de-energise, release stored energy, verify before touching);
// UK HSE guidance on rosin-based solder flux fume (extraction at source); lead handling: wash hands, no food at the
// bench (HSE, common practice). The product gives reminders, not training: local codes and licensed practice rule.
import type { CautionKind } from './bench-vocabulary.ts';

export interface Caution {
  title: string;
  text: string;
}

export const cautions: Record<CautionKind, Caution> = {
  mains: {
    title: 'Mains voltage',
    text:
      'Switch off and unplug the game before opening the power supply, and verify it is dead with a meter you have ' +
      'checked on a live source. Never work on a powered supply alone. Mains wiring is for qualified people: follow ' +
      'local electrical codes and licensed practice.',
  },
  live_work: {
    title: 'Measuring a live supply',
    text:
      'The supply is switched on for this step: its primary side, heat sinks and filter capacitors can be at mains ' +
      'voltage. Connect the meter with the power off, then switch on; use probes and a meter rated for mains (CAT II or ' +
      'better), keep one hand away from the board, and never work on a live supply alone. Where local practice calls ' +
      'for an isolation transformer or a current-limiting lamp, use one. Follow local electrical codes and licensed practice.',
  },
  charged_capacitors: {
    title: 'Charged capacitors',
    text:
      'Filter capacitors can hold a dangerous charge long after the game is unplugged. Discharge each one through a ' +
      'suitable resistor (not a screwdriver) and confirm 0 V across it with a meter before touching the board.',
  },
  hot_iron: {
    title: 'Hot iron',
    text:
      'The iron tip runs at 300–400 °C. Keep it in its stand, keep cables clear of it, wear eye protection when ' +
      'cutting leads or desoldering, and switch it off when you leave the bench.',
  },
  solder_fumes: {
    title: 'Solder and flux fumes',
    text:
      'Rosin flux fume irritates the lungs and can cause asthma. Use fume extraction at the iron, work in a ' +
      'ventilated room, and clean flux residue with the right solvent and gloves.',
  },
  leaded_solder: {
    title: 'Leaded solder',
    text:
      'Old boards and Sn63/Pb37 solder contain lead. Do not eat or drink at the bench, wash your hands after work, ' +
      'keep lead-free and leaded tips apart, and dispose of dross and wick as local rules require.',
  },
};

/** Said once under every caution list. */
export const cautionsDeferral =
  'These reminders do not replace training. Follow local codes, the maker’s instructions and licensed practice.';

// The blank sheet of a bench-job template, to work from at the bench with a pen: each step with its instructions and
// cautions, a box to tick, and per part a box for the reading beside the window it must fall in. Printed for one
// board's parts list, each per-part step lists that board's parts; without one, blank rows to fill in.
import type { BenchStep, PartKind } from '@bumperline/contracts/bench-vocabulary';
import { partKindLabels } from '@bumperline/contracts/bench-vocabulary';
import { BRIDGE_READING_KEYS, DIODE_READING_KEYS, formatWindow, partsForStep } from '@bumperline/domain/components/bench-judgement';
import { readPartEntry, type PartEntryInput, type PartSpec } from '@bumperline/domain/components/parts-list-entry';
import { toleranceWindow } from '@bumperline/domain/components/tolerance';
import { isDomainError } from '@bumperline/domain/errors';
import {
  cautionList,
  facts,
  heading,
  keepSpace,
  newSheet,
  paragraph,
  table,
  tickBox,
  title,
  writingLines,
  type Cell,
} from './pdf-sheet.ts';

export interface TemplateSheetInput {
  name: string;
  description: string;
  steps: readonly BenchStep[];
  /** The board it is printed for, with its parts list as written. */
  board?: { name: string; partNumber: string; parts: readonly (PartEntryInput & { id: string })[] };
}

type SheetPart = { entry: PartEntryInput; spec: PartSpec | null };

/** "540 Ω – 660 Ω" from the parts list, or what to write when the line does not give one. */
export function windowOf(spec: PartSpec | null): string {
  if (!spec?.nominal || !spec.unit || !spec.tolerance) return '';
  const { min, max } = toleranceWindow(spec.nominal, spec.tolerance);
  return formatWindow(min, max, spec.unit);
}

const BLANK_ROWS = 8;
const blank = (columns: number, rows = BLANK_ROWS): Cell[][] => Array.from({ length: rows }, () => Array<Cell>(columns).fill(''));
const kindsText = (kinds: readonly PartKind[]) => kinds.map((k) => partKindLabels[k].toLowerCase()).join(', ');

function stepParts(step: BenchStep, parts: readonly SheetPart[]): SheetPart[] {
  // partsForStep matches on kind and designator; a line that does not read is still listed, by its written kind.
  const specs = parts.filter((p) => p.spec).map((p) => ({ ...p.spec!, part: p }));
  const chosen = new Set(partsForStep(step, specs).map((s) => s.part));
  const kinds = new Set<string>(step.partKinds);
  const names = new Set(step.designators.map((d) => d.toUpperCase()));
  return parts.filter((p) => chosen.has(p) || (!p.spec && (kinds.has(p.entry.kind) || names.has(p.entry.designator.toUpperCase()))));
}

function partTables(doc: PDFKit.PDFDocument, step: BenchStep, parts: readonly SheetPart[] | null): void {
  const listed = parts ? stepParts(step, parts) : null;
  keepSpace(doc, 90);
  const concerns = [step.partKinds.length ? kindsText(step.partKinds) : '', step.designators.join(', ')].filter(Boolean).join('; ');
  if (concerns) paragraph(doc, `Parts: ${concerns}`, { muted: true, size: 9 });
  const named = (make: (p: SheetPart) => Cell[], columns: number): Cell[][] =>
    listed
      ? listed.map(make)
      : step.designators.length
        ? step.designators.map((d) => [d, ...Array<Cell>(columns - 1).fill('')])
        : blank(columns);
  switch (step.record) {
    case 'readings':
      table(
        doc,
        ['Part', 'Value', 'Tolerance', 'Allowed window', 'Reading', 'In circuit?', 'Pass / low / high'],
        named((p) => [p.entry.designator, p.entry.value, p.entry.tolerance, windowOf(p.spec), '', '☐', ''], 7),
        [0.1, 0.13, 0.11, 0.22, 0.16, 0.1, 0.18],
        20,
      );
      break;
    case 'diode_set': {
      const rows: Cell[][] = [];
      for (const p of listed ?? []) {
        if (p.entry.kind === 'bridge_rectifier') {
          for (const k of BRIDGE_READING_KEYS.filter((key) => key.required)) rows.push([p.entry.designator, p.entry.value, k.label, '']);
        } else for (const k of DIODE_READING_KEYS) rows.push([p.entry.designator, p.entry.value, k.label, '']);
        rows.push([p.entry.designator, '', 'Good as a set?', '☐ yes  ☐ no']);
      }
      table(doc, ['Part', 'Type', 'Diode test', 'Reading (V or OL)'], listed ? rows : blank(4), [0.12, 0.2, 0.4, 0.28], 18);
      break;
    }
    case 'fuse':
      table(
        doc,
        ['Fuse', 'The circuit needs', 'Marking on the fuse fitted', 'Current, voltage and speed match?'],
        named((p) => [p.entry.designator, p.entry.value, '', '☐ yes  ☐ no'], 4),
        [0.12, 0.25, 0.33, 0.3],
        20,
      );
      break;
    case 'power':
      table(
        doc,
        ['Part', 'Value', 'Rating', 'Volts across it', 'Within rating (derated)?'],
        named((p) => [p.entry.designator, p.entry.value, p.entry.rating, '', '☐ yes  ☐ no'], 5),
        [0.12, 0.16, 0.16, 0.26, 0.3],
        20,
      );
      break;
    default:
      break;
  }
}

/** The whole sheet as PDF bytes. */
export async function templateSheetPdf(input: TemplateSheetInput): Promise<Buffer> {
  const sheet = newSheet(input.name);
  const { doc } = sheet;
  title(doc, input.name, input.board ? `${input.board.name}${input.board.partNumber ? ` (${input.board.partNumber})` : ''}` : undefined);
  if (input.description) paragraph(doc, input.description);
  doc.moveDown(0.3);
  facts(doc, [
    ['Board serial', '______________________'],
    ['Game', '______________________'],
    ['Technician', '______________________'],
    ['Date', '______________'],
  ]);

  const parts: SheetPart[] | null = input.board
    ? input.board.parts.map((entry) => {
        try {
          return { entry, spec: readPartEntry(entry) };
        } catch (err) {
          if (!isDomainError(err)) throw err;
          return { entry, spec: null };
        }
      })
    : null;

  input.steps.forEach((step, i) => {
    heading(doc, `${i + 1}. ${step.title}`);
    if (step.instructions) paragraph(doc, step.instructions);
    doc.moveDown(0.2);
    cautionList(doc, step.cautions);
    if (step.cautions.length) tickBox(doc, 'I have read the cautions above');
    partTables(doc, step, parts);
    if (step.record === 'check') tickBox(doc, 'Checked — answer:  ☐ yes   ☐ no');
    if (step.record === 'parts_used') {
      table(doc, ['Part fitted', 'Quantity', 'Replaces (designator)'], blank(3, 6), [0.6, 0.15, 0.25], 20);
    }
    if (step.record === 'photo') tickBox(doc, 'Photo taken');
    if (step.record === 'note' || step.record === 'check') writingLines(doc, 'Notes', 2);
    tickBox(doc, 'Step done');
  });

  heading(doc, 'Parts used');
  table(doc, ['Part fitted', 'Quantity', 'Replaces (designator)'], blank(3, 8), [0.6, 0.15, 0.25], 20);
  writingLines(doc, 'Signed', 1);
  return sheet.finish();
}

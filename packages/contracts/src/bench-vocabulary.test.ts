// The domain package keeps its own copy of the part kinds and the shapes it judges (it has no runtime
// dependencies); these checks keep the copies in step with the words the API and the screens use.
import { describe, expect, expectTypeOf, it } from 'vitest';
import type { BenchJobDraftInput, BenchStepInput, BenchStepProgressInput } from '@bumperline/domain/components/bench-judgement';
import { PART_KIND_LABELS, PART_KIND_NAMES } from '@bumperline/domain/components/parts-list-entry';
import { partKindLabels, partKinds, type BenchJobDraft, type BenchStep, type BenchStepProgress } from './bench-vocabulary.ts';

describe('bench vocabulary and the domain agree', () => {
  it('has the same part kinds in the same order, with the same labels', () => {
    expect([...PART_KIND_NAMES]).toEqual([...partKinds]);
    expect(PART_KIND_LABELS).toEqual(partKindLabels);
  });

  it("a bench job's steps and draft fit what the domain judges", () => {
    expectTypeOf<BenchStep>().toExtend<BenchStepInput>();
    expectTypeOf<BenchStepProgress>().toExtend<BenchStepProgressInput>();
    expectTypeOf<BenchJobDraft>().toExtend<BenchJobDraftInput>();
  });
});

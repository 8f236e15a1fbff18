// One bench-job template: its steps in order, what each records and the parts it concerns, its cautions in full,
// and the blank sheet to print for the bench.
import { Link, useParams } from 'react-router-dom';
import { FileText, Pencil } from 'lucide-react';
import type { BenchStep } from '@bumperline/contracts/bench-vocabulary';
import { partKindLabels, stepRecordLabels } from '@bumperline/contracts/bench-vocabulary';
import { PageHeader } from '../../components/page-header.tsx';
import { ErrorState, Loading } from '../../components/states.tsx';
import { useBenchTemplate } from '../../api/bench-templates.ts';
import { useCan } from '../../api/use-can.ts';
import { paths } from '../../lib/paths.ts';
import { CautionList } from './caution-list.tsx';

export function BenchTemplatePage() {
  const { id = '' } = useParams();
  const template = useBenchTemplate(id);
  const canWrite = useCan('bench-templates:write');
  if (template.isLoading) return <Loading />;
  if (template.error || !template.data) return <ErrorState error={template.error} onRetry={() => template.refetch()} />;
  const t = template.data;
  return (
    <>
      <PageHeader
        title={t.name}
        subtitle={
          <>
            <Link className="link" to={paths.bench}>
              Bench
            </Link>{' '}
            · template of {t.steps.length} steps{t.description ? ` · ${t.description}` : ''}
          </>
        }
        actions={
          <>
            <a className="btn-secondary" href={paths.benchTemplateSheetPdf(t.id)} target="_blank" rel="noreferrer">
              <FileText aria-hidden className="size-4" /> Blank sheet (PDF)
            </a>
            {canWrite && (
              <Link className="btn-primary" to={paths.editBenchTemplate(t.id)}>
                <Pencil aria-hidden className="size-4" /> Edit
              </Link>
            )}
          </>
        }
      />
      <ol className="grid max-w-4xl gap-3">
        {t.steps.map((step, i) => (
          <li key={step.key} className="card grid gap-2">
            <h2 className="text-lg font-bold">
              <span className="text-ink-muted tabular">{i + 1}.</span> {step.title}
            </h2>
            <p className="text-sm font-semibold text-ink-soft">Records: {stepRecordLabels[step.record]}</p>
            {step.instructions && <p className="whitespace-pre-line">{step.instructions}</p>}
            <PartsConcerned step={step} />
            <CautionList kinds={step.cautions} />
          </li>
        ))}
      </ol>
    </>
  );
}

function PartsConcerned({ step }: { step: BenchStep }) {
  if (!step.partKinds.length && !step.designators.length) return null;
  return (
    <p>
      <span className="font-semibold">Parts: </span>
      {[
        step.partKinds.length ? `every ${step.partKinds.map((k) => partKindLabels[k].toLowerCase()).join(', ')}` : '',
        step.designators.length ? step.designators.join(', ') : '',
      ]
        .filter(Boolean)
        .join('; and ')}
    </p>
  );
}

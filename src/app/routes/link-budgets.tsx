/**
 * /benches/:benchId/link-budgets — a coherent link's phase-noise budget: the form, the verdict with its
 * caution, the table across symbol rates, and the bench's saved budgets (open, delete; save for owners
 * and analysts).
 */
import { useQuery, type QueryClient } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { useParams, type LoaderFunctionArgs } from 'react-router';
import type { EvaluateLinkBudgetRequest, LinkBudgetEvaluation, SavedLinkBudget } from '../../../server/contracts/link-budgets';
import { PageHeader } from '../../components/layout/page-header';
import { Button } from '../../components/ui/button';
import { TextField } from '../../components/ui/field';
import { DoneNote, FormAlert } from '../../components/ui/notes';
import { Panel, Section } from '../../components/ui/section';
import { paths } from '../../config/paths';
import { errorsFromFailure, type FieldErrors } from '../../lib/form';
import { useSignedInUser } from '../../features/auth/api/get-me';
import { benchQueryOptions, useBench } from '../../features/benches/api/get-bench';
import { capturesQueryOptions } from '../../features/captures/api/list-captures';
import { useEvaluateLinkBudget } from '../../features/link-budgets/api/evaluate-link-budget';
import { linkBudgetsQueryOptions, useLinkBudgets } from '../../features/link-budgets/api/get-link-budgets';
import { useSaveLinkBudget } from '../../features/link-budgets/api/save-link-budget';
import { INITIAL_BUDGET_VALUES, valuesFromRequest, type BudgetFormValues } from '../../features/link-budgets/components/budget-form-state';
import { LinkBudgetForm, type SpectrumChoice } from '../../features/link-budgets/components/link-budget-form';
import { LinkBudgetResult } from '../../features/link-budgets/components/link-budget-result';
import { SavedLinkBudgets } from '../../features/link-budgets/components/saved-link-budgets';

const CAPTURE_FILTERS = { page: 1, pageSize: 100 };
const FIELDS = [
  'format',
  'symbolRateBaud',
  'linewidthHz',
  'transmitter',
  'transmitter.analysisId',
  'transmitter.linewidthHz',
  'localOscillator',
  'localOscillator.analysisId',
  'localOscillator.linewidthHz',
  'carrierRecovery',
  'carrierRecovery.blockLength',
  'carrierRecovery.bandwidthHz',
] as const;

export const linkBudgetsLoader =
  (queryClient: QueryClient) =>
  async ({ params }: LoaderFunctionArgs) => {
    const benchId = params.benchId ?? '';
    await Promise.all([queryClient.ensureQueryData(benchQueryOptions(benchId)), queryClient.ensureQueryData(linkBudgetsQueryOptions(benchId))]);
    return null;
  };

export function LinkBudgetsRoute() {
  const benchId = useParams().benchId ?? '';
  const bench = useBench(benchId);
  const user = useSignedInUser();
  const budgets = useLinkBudgets(benchId);
  const captures = useQuery(capturesQueryOptions(benchId, CAPTURE_FILTERS));
  const canWrite = bench.role === 'owner' || bench.role === 'analyst';

  const spectra = useMemo<SpectrumChoice[]>(
    () =>
      (captures.data?.captures ?? [])
        .filter((c) => c.latestAnalysis?.status === 'done')
        .map((c) => ({ analysisId: c.latestAnalysis!.id, label: c.fileName })),
    [captures.data],
  );

  const [values, setValues] = useState<BudgetFormValues>(INITIAL_BUDGET_VALUES);
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [result, setResult] = useState<{ request: EvaluateLinkBudgetRequest; evaluation: LinkBudgetEvaluation; savedName?: string } | null>(null);
  const [name, setName] = useState('');
  const [saveError, setSaveError] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const evaluate = useEvaluateLinkBudget();
  const save = useSaveLinkBudget(benchId);

  function run(request: EvaluateLinkBudgetRequest) {
    setFieldErrors({});
    setFormError(null);
    setSaved(null);
    evaluate.mutate(request, {
      onSuccess: (evaluation) => setResult({ request, evaluation }),
      onError: (error) => {
        const e = errorsFromFailure(error, FIELDS);
        setFieldErrors(e.fieldErrors);
        setFormError(e.formError);
      },
    });
  }

  function saveResult() {
    if (!result) return;
    setSaveError(null);
    save.mutate(
      { name: name.trim(), input: result.request },
      {
        onSuccess: ({ linkBudget }) => {
          setSaved(`Saved on the bench as “${linkBudget.name}”.`);
          setName('');
        },
        onError: (error) => setSaveError(errorsFromFailure(error, []).formError),
      },
    );
  }

  function open(budget: SavedLinkBudget) {
    setValues(valuesFromRequest(budget.input));
    setFieldErrors({});
    setFormError(null);
    setSaved(null);
    setResult({ request: budget.input, evaluation: budget.result, savedName: budget.name });
  }

  return (
    <>
      <title>{`Link budgets · ${bench.name} · Phaseloom`}</title>
      <PageHeader
        trail={[
          { label: 'Benches', to: paths.benches.list.getHref() },
          { label: bench.name, to: paths.benches.home.getHref(bench.id) },
          { label: 'Link budgets' },
        ]}
        title="Link budget"
        lede="Will this transmitter and local oscillator carry a format at a symbol rate? Δν·T_s against the published tolerance for about 1 dB penalty, the margin, and the phase error left after carrier recovery."
      />
      <div className="mt-10 grid grid-cols-1 gap-10 lg:grid-cols-[minmax(0,26rem)_minmax(0,1fr)]">
        <Panel id="budget-form" title="Inputs">
          <LinkBudgetForm
            values={values}
            onChange={setValues}
            spectra={spectra}
            fieldErrors={fieldErrors}
            formError={formError}
            busy={evaluate.isPending}
            onValidated={run}
            onInvalid={(errors) => {
              setFieldErrors(errors);
              setFormError(null);
            }}
          />
        </Panel>
        <Section id="budget-result" title={result?.savedName ? `Result — ${result.savedName}` : 'Result'} lede="Estimates to be confirmed on the real link.">
          {result ? (
            <>
              <LinkBudgetResult result={result.evaluation} />
              {canWrite && !result.savedName && (
                <form
                  className="mt-6 flex flex-wrap items-end gap-3"
                  aria-label="Save the budget"
                  onSubmit={(e) => {
                    e.preventDefault();
                    saveResult();
                  }}
                >
                  <TextField label="Name" name="budgetName" value={name} onChange={(e) => setName(e.target.value)} fieldClassName="min-w-[16rem] flex-1" placeholder="e.g. Kestrel Tx with Wren LO at 32 GBd" />
                  <Button type="submit" variant="secondary" busy={save.isPending} busyLabel="Saving…" disabled={name.trim() === ''}>
                    Save on the bench
                  </Button>
                </form>
              )}
              <FormAlert message={saveError} className="mt-3" />
              <DoneNote message={saved} className="mt-3" />
            </>
          ) : (
            <p className="text-sm text-ink-faint">Fill in the inputs and evaluate; the verdict, the figures and a table across symbol rates appear here.</p>
          )}
        </Section>
      </div>
      <Section id="saved-budgets" className="mt-14" title="Saved on this bench" lede="Each kept with the inputs and the evaluation made when it was saved.">
        <SavedLinkBudgets benchId={bench.id} budgets={budgets} userId={user.id} role={bench.role} onOpen={open} />
      </Section>
    </>
  );
}

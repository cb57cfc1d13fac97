import { zodResolver } from '@hookform/resolvers/zod';
import { useForm, useWatch } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { z } from 'zod';
import { formatWithUncertainty } from '@shared/format/numbers';
import { CUTOFF_SCHEME_LABELS } from '@shared/physics/cutoff-schemes';
import { Button } from '@/components/ui/button';
import { Field, Input, Select } from '@/components/ui/field';
import { ProgressBar } from '@/components/ui/progress-bar';
import { EmptyState, ErrorState, LoadingState, PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { decimalOf, invalidProps, sameNames, useServerFieldErrors } from '@/lib/forms';
import { FitStatusBadge } from '@/features/fits/components/fit-status-badge';
import { FIELD_LABELS } from '@shared/schemas/field-labels';
import { createSimulationBody, SIMULATION_LIMITS } from '@shared/schemas/simulations';
import { useQueueState, useSimulations, useStartSimulation } from '@/features/simulations/api/simulations';
import { PhaseBadge } from '@/features/simulations/components/phase-badge';
import { SIMULATION_CUTOFF_SCHEMES } from '@shared/physics/cutoff-schemes';

/** What became of the run just started, kept current from the polled list (queued → running → finished). */
function StartedNotice({ id, reused }: { id: number; reused: boolean }) {
  const sims = useSimulations();
  const sim = sims.data?.find((s) => s.id === id);
  const status = sim?.status ?? 'queued';
  const link = (
    <Link className="underline" to={`/simulations/${id}`}>
      Simulation {id}
    </Link>
  );
  const text =
    status === 'succeeded' ? (
      <>
        {link} {reused ? 'is an identical earlier run, reused' : 'has finished'}
        {sim?.summary ? <>: ρ* = {formatWithUncertainty(sim.summary.reducedDensity, sim.summary.stdErr)}</> : null}.
      </>
    ) : status === 'running' ? (
      <>
        {link} is running ({Math.round((sim?.progress ?? 0) * 100)} %).
      </>
    ) : status === 'failed' ? (
      <>
        {link} failed{sim?.error ? `: ${sim.error}` : '.'}
      </>
    ) : status === 'cancelled' ? (
      <>{link} was cancelled.</>
    ) : (
      <>
        {link} {reused ? 'is an identical run already waiting; it is reused' : 'is queued'} and waits for a free worker.
      </>
    );
  return (
    <p role="status" data-testid="started-simulation" className={`text-sm ${status === 'failed' ? 'text-changes' : 'text-approved'}`}>
      {text}
    </p>
  );
}

const startFormShape = z.object({
  reducedTemperature: z.string(),
  reducedPressure: z.string(),
  atoms: z.string(),
  steps: z.string(),
  cutoff: z.string(),
  scheme: z.enum(SIMULATION_CUTOFF_SCHEMES),
});
type StartFormValues = z.input<typeof startFormShape>;
const START_FIELDS = ['reducedTemperature', 'reducedPressure', 'atoms', 'steps', 'cutoff', 'scheme'] as const;

/** The boxes as typed become the request, judged by createSimulationBody (the server's schema). */
const startFormSchema = startFormShape
  .transform((v): z.input<typeof createSimulationBody> => {
    const n = (s: string) => decimalOf(s) ?? Number.NaN;
    return {
      reducedTemperature: n(v.reducedTemperature),
      reducedPressure: n(v.reducedPressure),
      atoms: n(v.atoms),
      steps: n(v.steps),
      scheme: v.scheme,
      cutoff: n(v.cutoff),
    };
  })
  .pipe(createSimulationBody);

function StartForm() {
  const start = useStartSimulation();
  const form = useForm<StartFormValues, unknown, z.output<typeof createSimulationBody>>({
    resolver: zodResolver(startFormSchema),
    defaultValues: {
      reducedTemperature: '1.2',
      reducedPressure: '0.5',
      atoms: '500',
      steps: '20000',
      scheme: 'truncated-tail',
      cutoff: '2.5',
    },
  });
  const errors = form.formState.errors;
  useServerFieldErrors(start.error, form.setError, sameNames(START_FIELDS));
  const [atoms, steps] = useWatch({ control: form.control, name: ['atoms', 'steps'] });
  const atomSteps = Number(atoms) * Number(steps);
  const tooMuch = Number.isFinite(atomSteps) && atomSteps > SIMULATION_LIMITS.maxAtomSteps;
  // Said while typing, before any submit (the schema says it too, in its own words, on submit).
  const stepsError = tooMuch
    ? `Atoms × steps may be at most ${SIMULATION_LIMITS.maxAtomSteps.toLocaleString('en-GB')} per run (a density fit uses 256 × 10 000).`
    : errors.steps?.message;
  const box = (
    name: Exclude<(typeof START_FIELDS)[number], 'scheme'>,
    id: string,
    inputMode: 'decimal' | 'numeric',
    message = errors[name]?.message,
  ) => <Input id={id} inputMode={inputMode} {...invalidProps(id, message)} {...form.register(name)} />;
  return (
    <form noValidate className="grid gap-3" onSubmit={form.handleSubmit((body) => !tooMuch && start.mutate(body))}>
      <div className="grid grid-cols-2 gap-3">
        <Field label={FIELD_LABELS.reducedTemperature} htmlFor="sim-t" error={errors.reducedTemperature?.message}>
          {box('reducedTemperature', 'sim-t', 'decimal')}
        </Field>
        <Field label={FIELD_LABELS.reducedPressure} htmlFor="sim-p" error={errors.reducedPressure?.message}>
          {box('reducedPressure', 'sim-p', 'decimal')}
        </Field>
        <Field
          label={FIELD_LABELS.atoms}
          htmlFor="sim-n"
          hint={`${SIMULATION_LIMITS.minAtoms}–${SIMULATION_LIMITS.maxAtoms.toLocaleString('en-GB')}`}
          error={errors.atoms?.message}
        >
          {box('atoms', 'sim-n', 'numeric')}
        </Field>
        <Field
          label={FIELD_LABELS.steps}
          htmlFor="sim-steps"
          hint={`${SIMULATION_LIMITS.minSteps.toLocaleString('en-GB')}–${SIMULATION_LIMITS.maxSteps.toLocaleString('en-GB')}`}
          error={stepsError}
        >
          {box('steps', 'sim-steps', 'numeric', stepsError)}
        </Field>
        <Field label={FIELD_LABELS.cutoff} htmlFor="sim-rc" error={errors.cutoff?.message}>
          {box('cutoff', 'sim-rc', 'decimal')}
        </Field>
        <Field label="Scheme" htmlFor="sim-scheme" error={errors.scheme?.message}>
          <Select id="sim-scheme" {...invalidProps('sim-scheme', errors.scheme?.message)} {...form.register('scheme')}>
            <option value="truncated-tail">truncated + tail corrections</option>
            <option value="truncated-shifted">truncated and shifted</option>
          </Select>
        </Field>
      </div>
      {start.isError && (
        <p role="alert" className="text-sm text-changes">
          {start.error.message}
        </p>
      )}
      {start.isSuccess && <StartedNotice id={start.data.id} reused={start.data.reused} />}
      <p className="text-xs text-ink-faint">
        Limits per run: {SIMULATION_LIMITS.minAtoms}–{SIMULATION_LIMITS.maxAtoms.toLocaleString('en-GB')} atoms,{' '}
        {SIMULATION_LIMITS.minSteps.toLocaleString('en-GB')}–{SIMULATION_LIMITS.maxSteps.toLocaleString('en-GB')} steps, atoms × steps ≤{' '}
        {SIMULATION_LIMITS.maxAtomSteps.toLocaleString('en-GB')}.
      </p>
      <div>
        <Button type="submit" variant="primary" busy={start.isPending} disabled={tooMuch}>
          Run NPT simulation
        </Button>
      </div>
    </form>
  );
}

/** The job queue for the admin: driver, what waits and runs in each lane, and the live worker processes. */
function QueuePanel() {
  const queue = useQueueState();
  return (
    <Panel title="Job queue">
      {queue.isPending ? (
        <LoadingState />
      ) : queue.isError ? (
        <ErrorState error={queue.error} onRetry={() => queue.refetch()} />
      ) : (
        <div className="grid gap-3 text-sm">
          <p>
            {queue.data.driver === 'redis' ? 'Redis (BullMQ): jobs run on worker processes.' : 'Embedded: jobs run in the web process.'}{' '}
            {queue.data.workers} live worker process{queue.data.workers === 1 ? '' : 'es'}.
          </p>
          <table className="w-full text-left">
            <thead>
              <tr className="text-xs text-ink-faint">
                <th scope="col" className="py-1 font-semibold">
                  Lane
                </th>
                <th scope="col" className="py-1 font-semibold">
                  Waiting
                </th>
                <th scope="col" className="py-1 font-semibold">
                  Running
                </th>
                <th scope="col" className="py-1 font-semibold">
                  Retry pending
                </th>
              </tr>
            </thead>
            <tbody className="num">
              {(['simulation', 'fast'] as const).map((lane) => (
                <tr key={lane}>
                  <th scope="row" className="py-1 font-normal">
                    {lane === 'fast' ? 'Fast fits' : 'Simulations'}
                  </th>
                  <td>{queue.data.lanes[lane].waiting}</td>
                  <td>{queue.data.lanes[lane].active}</td>
                  <td>{queue.data.lanes[lane].delayed}</td>
                </tr>
              ))}
            </tbody>
          </table>
          {queue.data.workerList.length === 0 ? (
            <p className="text-changes">No worker process is running: queued jobs wait until one starts (npm run worker).</p>
          ) : (
            <ul className="grid gap-1" aria-label="Worker processes">
              {queue.data.workerList.map((w) => (
                <li key={w.name}>
                  <span className="font-semibold">{w.name}</span> · {w.threads.simulation} simulation and {w.threads.fast} fast thread
                  {w.threads.fast === 1 ? '' : 's'} · {w.active} running
                </li>
              ))}
            </ul>
          )}
        </div>
      )}
    </Panel>
  );
}

export function SimulationsRoute() {
  const sims = useSimulations();
  const canRun = useCan('simulation:run');
  const isAdmin = useCan('people:manage');
  return (
    <>
      <PageHeader
        eyebrow="Molecular dynamics"
        title="Simulations"
        subtitle="NPT runs of the LJ fluid at reduced state points. One run serves every substance whose (ε, σ) maps to its state; identical requests reuse the stored result."
      />
      <div className={`grid gap-6 ${canRun || isAdmin ? 'lg:grid-cols-[2fr_1fr]' : ''}`}>
        <Panel title="Runs">
          {sims.isPending ? (
            <LoadingState />
          ) : sims.isError ? (
            <ErrorState error={sims.error} onRetry={() => sims.refetch()} />
          ) : sims.data.length === 0 ? (
            <EmptyState title="No simulations yet">Run a state point here, or from a density set's page.</EmptyState>
          ) : (
            <ul className="divide-y divide-rule/70">
              {sims.data.map((s) => (
                <li key={s.id} className="py-3">
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <Link
                      to={`/simulations/${s.id}`}
                      className="font-semibold underline decoration-rule underline-offset-4 hover:decoration-copper"
                    >
                      Simulation {s.id}: T* = {s.state.reducedTemperature.toFixed(4)}, P* = {s.state.reducedPressure.toFixed(4)}
                    </Link>
                    <span className="flex items-center gap-2">
                      {s.summary && <PhaseBadge phase={s.summary.phase} />}
                      <FitStatusBadge status={s.status} />
                    </span>
                  </div>
                  <div className="mt-1 text-xs text-ink-faint">
                    {s.state.atoms} atoms · {s.state.steps} steps · r_c = {s.state.cutoff} σ ·{' '}
                    {CUTOFF_SCHEME_LABELS[s.state.scheme]?.toLowerCase() ?? s.state.scheme} · seed {s.state.seed}
                    {s.origin && (
                      <>
                        {' '}
                        · from row {s.origin.fileRow} of set {s.origin.measurementSetId} (ε/k_B = {s.origin.epsilonK} K, σ ={' '}
                        {s.origin.sigmaAngstrom} Å)
                      </>
                    )}
                    {s.ranOn && (
                      <>
                        {' '}
                        · {s.status === 'running' ? 'running on' : 'ran on'} {s.ranOn}
                        {s.attempts > 1 ? ` (start ${s.attempts})` : ''}
                      </>
                    )}
                  </div>
                  {(s.status === 'running' || s.status === 'queued') && (
                    <div className="mt-2">
                      <ProgressBar
                        fraction={s.progress}
                        label={s.status === 'queued' ? 'Waiting for a free worker' : (s.stage ?? 'Running')}
                      />
                    </div>
                  )}
                  {s.summary && (
                    <div className="num mt-1 text-sm">ρ* = {formatWithUncertainty(s.summary.reducedDensity, s.summary.stdErr)}</div>
                  )}
                  {s.status === 'failed' && <div className="mt-1 text-sm text-changes">{s.error}</div>}
                </li>
              ))}
            </ul>
          )}
        </Panel>
        {(canRun || isAdmin) && (
          <div className="grid content-start gap-6">
            {canRun && (
              <Panel title="New run">
                <StartForm />
              </Panel>
            )}
            {isAdmin && <QueuePanel />}
          </div>
        )}
      </div>
    </>
  );
}

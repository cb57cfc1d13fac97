import { formatDateTime } from '@shared/format/dates';
import { formatMeasured } from '@shared/format/numbers';
import { Badge } from '@/components/ui/badge';
import { Panel } from '@/components/ui/states';
import type { ValidationCheckResult, ValidationSuiteRun, ValidationTestSuiteOnly } from '../api/validation-suite';

const unitText = (unit: string) => (unit === '1' ? '' : ` ${unit}`);
const valueText = (value: number | null) => (value === null ? '—' : formatMeasured(value, 10));
const differenceText = (value: number | null) => (value === null ? '—' : value === 0 ? '0' : value.toExponential(2));

/** The summary line: n passed of N, when and by which code the server ran them. */
export function ValidationSummary({ run }: { run: ValidationSuiteRun }) {
  const allPassed = run.summary.failed === 0;
  return (
    <Panel>
      <div className="flex flex-wrap items-baseline gap-x-6 gap-y-2" data-testid="validation-summary">
        <p className="text-lg font-semibold">
          <span className={allPassed ? 'text-approved' : 'text-changes'}>
            {run.summary.passed} of {run.summary.total} checks passed
          </span>
          {!allPassed && <span className="ml-2 text-changes">({run.summary.failed} failed)</span>}
        </p>
        <p className="text-sm text-ink-soft">
          Run on this server {formatDateTime(run.ranAt)} in <span className="num">{(run.durationMs / 1000).toFixed(1)}</span> s
          {run.cached ? ' (kept since then)' : ''}
        </p>
        <p className="text-sm text-ink-soft">
          Code version <code className="num rounded bg-paper-deep px-1">{run.codeVersion}</code>
        </p>
      </div>
      <p className="mt-2 text-sm text-ink-soft">
        Each check compares a number computed by this server's code with a published or independent value, within the tolerance the unit
        tests use (the tests read the same entries from <code>shared/validation</code>). {run.summary.testSuiteOnly} simulation checks take
        minutes and run in the test suite only; they are listed at the end.
      </p>
    </Panel>
  );
}

/** One area (B2, viscosity, …) as a disclosure: closed when every check passed, open when one failed. */
export function ValidationArea({ area, checks }: { area: string; checks: ValidationCheckResult[] }) {
  const passed = checks.filter((c) => c.passed).length;
  const allPassed = passed === checks.length;
  return (
    <details open={!allPassed} className="group rounded-lg border border-rule bg-paper-raised" data-area={area}>
      <summary className="flex cursor-pointer items-center justify-between gap-3 rounded-lg px-4 py-3 hover:bg-paper-deep/40 focus-visible:outline-2 focus-visible:outline-copper">
        <span className="font-semibold">
          <span aria-hidden="true" className="mr-2 inline-block text-ink-faint transition-transform group-open:rotate-90">
            ▸
          </span>
          {area}
        </span>
        <Badge tone={allPassed ? 'approved' : 'changes'}>
          {passed} of {checks.length} passed
        </Badge>
      </summary>
      <div className="overflow-x-auto px-4 pb-4">
        <table className="w-full min-w-[64rem] text-sm">
          <caption className="sr-only">Reference checks of {area}</caption>
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th scope="col" className="py-1.5 text-left">
                Check
              </th>
              <th scope="col" className="text-left">
                Source
              </th>
              <th scope="col" className="text-right">
                Reference
              </th>
              <th scope="col" className="text-right">
                Ours
              </th>
              <th scope="col" className="text-right">
                Difference
              </th>
              <th scope="col" className="pl-3 text-left">
                Tolerance
              </th>
              <th scope="col" className="text-left">
                Verdict
              </th>
            </tr>
          </thead>
          <tbody>
            {checks.map((c) => (
              <tr key={c.id} className="border-b border-rule/60 align-top" data-check={c.id}>
                <td className="max-w-[22rem] py-1.5 pr-3">
                  <div>{c.quantity}</div>
                  <div className="text-xs text-ink-faint">
                    {c.state}
                    {c.unit !== '1' && <> · in {c.unit}</>}
                  </div>
                </td>
                <td className="max-w-[20rem] pr-3 text-ink-soft">{c.source}</td>
                <td className="num text-right">{valueText(c.reference)}</td>
                <td className="num text-right">{valueText(c.ours)}</td>
                <td className="num text-right">{differenceText(c.difference)}</td>
                <td className="num pl-3">
                  {c.toleranceText}
                  {c.tolerance.kind === 'absolute' ? unitText(c.unit) : ''}
                </td>
                <td>
                  {c.passed ? <Badge tone="approved">Pass</Badge> : <Badge tone="changes">Fail</Badge>}
                  {c.error && <div className="mt-1 text-xs text-changes">{c.error}</div>}
                  <div className="mt-1 text-xs text-ink-faint num">{c.durationMs < 1 ? '< 1' : Math.round(c.durationMs)} ms</div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}

/** Checks too slow for a page: shown with source and tolerance, marked as run in the test suite only. */
export function TestSuiteOnlyChecks({ checks }: { checks: ValidationTestSuiteOnly[] }) {
  if (checks.length === 0) return null;
  return (
    <Panel title="Run in the test suite only (too slow for a page)">
      <div className="overflow-x-auto">
        <table className="w-full min-w-[56rem] text-sm">
          <caption className="sr-only">Simulation checks that only the test suite runs</caption>
          <thead className="border-b border-rule text-xs tracking-wide text-ink-faint">
            <tr>
              <th scope="col" className="py-1.5 text-left">
                Check
              </th>
              <th scope="col" className="text-left">
                Source
              </th>
              <th scope="col" className="text-right">
                Reference
              </th>
              <th scope="col" className="pl-3 text-left">
                Tolerance
              </th>
              <th scope="col" className="text-left">
                Test
              </th>
            </tr>
          </thead>
          <tbody>
            {checks.map((c) => (
              <tr key={c.id} className="border-b border-rule/60 align-top">
                <td className="max-w-[22rem] py-1.5 pr-3">
                  <div>{c.quantity}</div>
                  <div className="text-xs text-ink-faint">{c.state}</div>
                </td>
                <td className="max-w-[20rem] pr-3 text-ink-soft">{c.source}</td>
                <td className="num text-right">
                  {formatMeasured(c.reference, 6)}
                  {unitText(c.unit)}
                </td>
                <td className="pl-3">{c.tolerance}</td>
                <td>
                  <Badge tone="slate">Test suite only</Badge>
                  <div className="mt-1 text-xs text-ink-faint">
                    <code>{c.testFile}</code>; {c.why.replace('run in the test suite only (too slow for a page): ', '')}
                  </div>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </Panel>
  );
}

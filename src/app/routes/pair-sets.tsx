import { Link } from 'react-router-dom';
import { PageHeader, Panel } from '@/components/ui/states';
import { useCan } from '@/lib/authorization';
import { PairSetForm } from '@/features/pair-sets/components/pair-set-form';
import { PairSetTable } from '@/features/pair-sets/components/pair-set-table';

/** Fitted cross interactions: k_ij (and l_ij) from measured B12 of two approved sets, reviewed before the Mixtures page uses them. */
export function PairSetsRoute() {
  const canDraft = useCan('parameterSet:draft');
  return (
    <>
      <PageHeader
        eyebrow="Catalog"
        title="Pair sets"
        subtitle={
          <>
            ε12 = (1 − k_ij)√(ε1ε2) fitted to cross second virial coefficients with both approved sets fixed. Approved pair sets replace the
            combining rule on the{' '}
            <Link className="text-copper underline" to="/mixtures">
              Mixtures
            </Link>{' '}
            page and in mixture exports.
          </>
        }
      />
      <div className="grid gap-6">
        {canDraft && (
          <Panel title="Fit a pair set">
            <PairSetForm />
          </Panel>
        )}
        <Panel title="Pair sets">
          <PairSetTable />
        </Panel>
      </div>
    </>
  );
}

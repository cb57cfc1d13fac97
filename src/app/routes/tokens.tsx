import { PageHeader, Panel } from '@/components/ui/states';
import { TokenPanel } from '@/features/tokens/components/token-panel';

/** Personal read-only API tokens for scripts that read the catalog and download exports. */
export function TokensRoute() {
  return (
    <>
      <PageHeader
        eyebrow="Account"
        title="API tokens"
        subtitle={
          <>
            Read-only: a token reaches the catalog, exports, mixtures and the schemas, and nothing else. The API is described at{' '}
            <a className="text-copper underline" href="/api/openapi.json">
              /api/openapi.json
            </a>
            .
          </>
        }
      />
      <Panel>
        <TokenPanel />
      </Panel>
    </>
  );
}

import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router';
import { lotQueries, lotsApi } from '../api/lotsApi.js';
import { useMe } from '../auth/useMe.js';
import { QueryStatus } from '../components/QueryState.js';
import { Button, PageTitle, Panel } from '../components/ui.js';
import { formatSig } from '../format/formatSi.js';
import { formatWhen } from '../format/formatWhen.js';
import { ApplyLotPanel } from '../lots/ApplyLotPanel.js';
import { LotQuantityView } from '../lots/LotQuantityView.js';
import { canManageLots } from '../lots/lotRoles.js';

/** One lot: its statistics per measured quantity, and applying it to a design. */
export function LotDetailPage() {
  const { id } = useParams();
  const me = useMe();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const lot = useQuery(lotQueries.detail(id!));
  const remove = useMutation({
    mutationFn: () => lotsApi.remove(id!),
    onSuccess: async () => {
      await qc.invalidateQueries({ queryKey: lotQueries.all });
      void navigate('/production/lots');
    },
  });
  const l = lot.data;
  return (
    <div className="space-y-4">
      <Link to="/production/lots" className="text-sm text-dim underline">
        ← Lots
      </Link>
      <QueryStatus query={lot} label="Loading the lot…" />
      {l && (
        <>
          <PageTitle
            sub={
              <>
                {l.kind === 'tube'
                  ? `${l.count} ${l.tubeType} tubes, ${l.quantity === 'ia-gm' ? 'Ia and gm' : 'mu and rp'} per section at Va ${l.testPoint?.va} V, Vg ${l.testPoint?.vg} V`
                  : `${l.count} resistors`}
                {` · ${l.fileName ?? ''} · uploaded ${formatWhen(l.createdAt)} by ${l.createdByName}`}
              </>
            }
          >
            {l.name}
          </PageTitle>
          <Panel title="Statistics">
            <div className="space-y-8">
              {l.quantities.map((q) => (
                <LotQuantityView key={q.key} label={q.label} unit={q.unit} summary={q.summary} />
              ))}
              {l.sectionCorrelation !== null && (
                <p className="text-sm">
                  Section-to-section correlation of the current scale (ln perveance):{' '}
                  <span className="num">{formatSig(l.sectionCorrelation, 3)}</span>. Applied to a design, the
                  lot keeps it: each sample draws one whole tube.
                </p>
              )}
            </div>
          </Panel>
          {canManageLots(me.role) && (
            <Panel
              title="Use in a design"
              actions={
                <Button tone="danger" onClick={() => window.confirm('Delete this lot?') && remove.mutate()}>
                  Delete lot
                </Button>
              }
            >
              <ApplyLotPanel lot={l} />
            </Panel>
          )}
        </>
      )}
    </div>
  );
}

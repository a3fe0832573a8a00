import type { Design } from '@sigmatail/engine';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router';
import { api } from '../api/client.js';
import { designQueries } from '../api/queries/designQueries.js';
import { can } from '../auth/permissions.js';
import { useMe } from '../auth/useMe.js';
import { ErrorNote, Loading } from '../components/QueryState.js';
import { SafetyCaution } from '../components/SafetyCaution.js';
import { PageTitle } from '../components/ui.js';
import { defaultDesign } from '../design/defaultDesign.js';
import { ArchiveButton } from '../design/ArchiveButton.js';
import { DesignForm } from '../design/DesignForm.js';
import { RevisionList } from '../design/RevisionList.js';
import { RunLaunchPanel } from '../runs/RunLaunchPanel.js';
import { DesignRunsPanel } from '../runs/DesignRunsPanel.js';

export function DesignEditorPage() {
  const { id } = useParams();
  const me = useMe();
  const qc = useQueryClient();
  const navigate = useNavigate();
  const mayEdit = can(me.role, 'editDesign');
  const detail = useQuery({ ...designQueries.detail(id ?? ''), enabled: id !== undefined });

  if (id === undefined) {
    if (!mayEdit) return <ErrorNote error={new Error(`Your role (${me.role}) cannot create designs.`)} />;
    return (
      <div className="space-y-4">
        <PageTitle sub="Describe the stage; nominal results update as you type.">New design</PageTitle>
        <SafetyCaution compact />
        <DesignForm
          initial={defaultDesign()}
          readOnly={false}
          saveLabel="Create design"
          onSave={async (doc, message) => {
            const { design } = await api.designs.create(doc, message || undefined);
            await qc.invalidateQueries({ queryKey: designQueries.all });
            navigate(`/designs/${design.id}`, { replace: true });
          }}
        />
      </div>
    );
  }

  if (detail.isPending) return <Loading label="Loading design…" />;
  if (detail.isError) return <ErrorNote error={detail.error} onRetry={() => detail.refetch()} />;
  const d = detail.data;
  const rev = d.latestRev;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-start justify-between gap-3">
        <PageTitle
          sub={
            <span className="num">
              revision {rev}
              {d.archivedAt ? ' · archived' : ''}
            </span>
          }
        >
          {d.name}
        </PageTitle>
        <div className="flex gap-2">
          <Link
            className="rounded-md border border-rule bg-white px-3 py-1.5 text-sm text-petrol hover:bg-petrol-soft"
            to={`/production/report/${d.id}`}
          >
            Production report
          </Link>
          {mayEdit && <ArchiveButton designId={d.id} archived={d.archivedAt !== null} />}
        </div>
      </div>
      <SafetyCaution compact />
      <DesignForm
        key={`${d.id}-${rev}`}
        initial={d.latestRevision.document as Design}
        readOnly={!mayEdit}
        banner={
          !mayEdit && (
            <p className="mb-3 rounded-md bg-petrol-soft px-3 py-2 text-sm text-petrol" role="note">
              Read-only: your role ({me.role}) can view this design but not change it.
            </p>
          )
        }
        onSave={async (doc, message) => {
          await api.designs.saveRevision(d.id, doc, message || undefined);
          await qc.invalidateQueries({ queryKey: designQueries.all });
        }}
      />
      <div className="grid gap-4 lg:grid-cols-2">
        <RunLaunchPanel designId={d.id} revision={rev} />
        <RevisionList designId={d.id} />
      </div>
      <DesignRunsPanel designId={d.id} />
    </div>
  );
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../api/client.js';
import { designQueries } from '../api/queries/designQueries.js';
import { ErrorNote } from '../components/QueryState.js';
import { Button } from '../components/ui.js';

/** Archive (hide from the list) or restore a design; only rendered for roles that may edit. */
export function ArchiveButton({ designId, archived }: { designId: string; archived: boolean }) {
  const qc = useQueryClient();
  const toggle = useMutation({
    mutationFn: () => api.designs.archive(designId, !archived),
    onSettled: () => qc.invalidateQueries({ queryKey: designQueries.all }),
  });
  return (
    <div className="flex items-center gap-2">
      <Button
        tone={archived ? 'plain' : 'danger'}
        disabled={toggle.isPending}
        onClick={() => toggle.mutate()}
      >
        {archived ? 'Restore design' : 'Archive design'}
      </Button>
      {toggle.isError && <ErrorNote error={toggle.error} />}
    </div>
  );
}

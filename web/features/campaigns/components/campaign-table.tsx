import { createColumnHelper, getCoreRowModel, useReactTable } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import { DataTable } from '../../../components/data-table';
import { paths } from '../../../config/paths';
import { formatDateTimeUtc } from '../../../lib/format';
import { FINAL_CAMPAIGN_STATUSES, type Campaign } from '../api/get-campaigns';
import { CampaignProgressBar, StatusBadge } from './campaign-status';

const column = createColumnHelper<Campaign>();
const columns = [
  column.accessor('name', {
    header: 'Campaign',
    cell: (info) => (
      <Link to={paths.campaign.href(info.row.original.id)} className="rounded-sm font-medium text-ember-300 hover:underline">
        {info.getValue()}
      </Link>
    ),
  }),
  column.accessor('status', { header: 'Status', cell: (info) => <StatusBadge status={info.getValue()} /> }),
  column.display({
    id: 'progress',
    header: 'Progress',
    cell: ({ row }) => {
      const c = row.original;
      return FINAL_CAMPAIGN_STATUSES.has(c.status) ? (
        <span className="font-mono text-night-200">
          {c.progress.done}/{c.progress.total} pulsars
        </span>
      ) : (
        <CampaignProgressBar label={`Progress of ${c.name}`} {...c.progress} />
      );
    },
  }),
  column.accessor('revisionChoice', { header: 'Revision', cell: (info) => (info.getValue() === 'released' ? 'released' : 'latest') }),
  column.accessor('createdAt', { header: 'Started', cell: (info) => <span className="text-night-200">{formatDateTimeUtc(info.getValue())}</span> }),
];

/** Every campaign, newest first as the API sends them. */
export function CampaignTable({ campaigns }: { campaigns: Campaign[] }) {
  const table = useReactTable({ data: campaigns, columns, getCoreRowModel: getCoreRowModel(), getRowId: (c) => String(c.id) });
  return (
    <DataTable table={table} aria-label="Campaigns" />
  );
}

// The steward desk (PRODUCT.md screen 10): community health, mentor applications, people and
// roles, reported messages, field notes held out of the library, the audit log, and the caught
// mail while the local catcher runs.
import type { QueryClient } from '@tanstack/react-query';
import { useQuery } from '@tanstack/react-query';
import { useSearchParams } from 'react-router';
import { ContentLayout } from '../../../components/layouts/content-layout';
import { applicationsQueryOptions } from '../../../features/mentor-applications/api/get-applications';
import { ApplicationsPanel } from '../../../features/mentor-applications/components/applications-panel';
import { reportsQueryOptions } from '../../../features/moderation/api/get-reports';
import { ReportsPanel } from '../../../features/moderation/components/reports-panel';
import { caughtMailQueryOptions } from '../../../features/steward/api/get-mail';
import { metricsQueryOptions } from '../../../features/steward/api/get-metrics';
import { AuditLogPanel } from '../../../features/steward/components/audit-log-panel';
import { CommunityHealth } from '../../../features/steward/components/community-health';
import { DeskTabs, type DeskTab } from '../../../features/steward/components/desk-tabs';
import { LibraryHoldsPanel } from '../../../features/steward/components/library-holds-panel';
import { MailPanel } from '../../../features/steward/components/mail-panel';
import { PeoplePanel } from '../../../features/steward/components/people-panel';

const TAB_IDS = ['health', 'applications', 'people', 'reports', 'library', 'audit', 'mail'] as const;
type TabId = (typeof TAB_IDS)[number];

const PENDING = { status: 'pending', page: 1 } as const;
const OPEN = { status: 'open', page: 1 } as const;

export const clientLoader = (queryClient: QueryClient) => async () => {
  // Warm what the first view needs; a failure shows in the panel itself, not as a broken page.
  await Promise.allSettled([
    queryClient.ensureQueryData(metricsQueryOptions()),
    queryClient.ensureQueryData(applicationsQueryOptions(PENDING)),
    queryClient.ensureQueryData(reportsQueryOptions(OPEN)),
  ]);
  return null;
};

export default function StewardDeskRoute() {
  const [params, setParams] = useSearchParams();
  const pending = useQuery(applicationsQueryOptions(PENDING));
  const open = useQuery(reportsQueryOptions(OPEN));
  // The mail page exists only while the local catcher is in use; elsewhere the server answers 404.
  const mail = useQuery({ ...caughtMailQueryOptions(1), retry: false });

  const tabs: DeskTab<TabId>[] = [
    { id: 'health', label: 'Community health' },
    { id: 'applications', label: 'Mentor applications', count: pending.data?.total },
    { id: 'people', label: 'People' },
    { id: 'reports', label: 'Reports', count: open.data?.total },
    { id: 'library', label: 'Notes held out' },
    { id: 'audit', label: 'Audit log' },
    ...(mail.isSuccess ? [{ id: 'mail' as const, label: 'Mail' }] : []),
  ];
  const asked = params.get('tab') as TabId | null;
  const current: TabId = asked && tabs.some((t) => t.id === asked) ? asked : 'health';
  const select = (id: TabId) => setParams(id === 'health' ? {} : { tab: id }, { replace: true, preventScrollReset: true });

  return (
    <ContentLayout title="Steward desk" lead="How fast growers are helped, who may advise, and what was said — in one place.">
      <DeskTabs tabs={tabs} current={current} onSelect={select} label="Steward desk">
        {current === 'health' && <CommunityHealth />}
        {current === 'applications' && <ApplicationsPanel />}
        {current === 'people' && <PeoplePanel />}
        {current === 'reports' && <ReportsPanel />}
        {current === 'library' && <LibraryHoldsPanel />}
        {current === 'audit' && <AuditLogPanel />}
        {current === 'mail' && <MailPanel />}
      </DeskTabs>
    </ContentLayout>
  );
}

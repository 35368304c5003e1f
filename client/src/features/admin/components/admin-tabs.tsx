import { Tabs } from '@mantine/core';
import { useNavigate } from 'react-router-dom';
import { paths } from '../../../config/paths';

type AdminPage = 'accounts' | 'audit-log';

/** The two admin pages as tabs that navigate. */
export function AdminTabs({ active }: { active: AdminPage }) {
  const navigate = useNavigate();
  return (
    <Tabs
      value={active}
      onChange={(value) => void navigate(value === 'audit-log' ? paths.auditLog.getHref() : paths.accounts.getHref())}
    >
      <Tabs.List>
        <Tabs.Tab value="accounts">Accounts</Tabs.Tab>
        <Tabs.Tab value="audit-log">Audit log</Tabs.Tab>
      </Tabs.List>
    </Tabs>
  );
}

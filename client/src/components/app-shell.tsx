import type { ReactNode } from 'react';
import {
  ActionIcon,
  AppShell as MantineAppShell,
  Avatar,
  Badge,
  Box,
  Burger,
  Button,
  Group,
  Menu,
  Text,
  Tooltip,
  UnstyledButton,
  useComputedColorScheme,
  useMantineColorScheme,
} from '@mantine/core';
import { useDisclosure } from '@mantine/hooks';
import { Link } from 'react-router-dom';
import type { CurrentUser } from '@ladderwright/shared/api';
import { paths } from '../config/paths';
import { HvCaution } from './hv-caution';

export interface AppShellProps {
  user: CurrentUser;
  onSignOut: () => void;
  isSigningOut?: boolean;
  /** The navigation column (projects and the sections of the open project). */
  navigation: ReactNode;
  /** Inbox items waiting for the user to act, shown beside the Inbox link. */
  inboxCount?: number;
  children: ReactNode;
}

const headerHeightPx = 52;

function initialsOf(name: string): string {
  const parts = name.trim().split(/\s+/).filter(Boolean);
  const letters = parts.length > 1 ? [parts[0], parts[parts.length - 1]] : parts;
  return letters.map((part) => (part ?? '').charAt(0).toUpperCase()).join('') || '?';
}

export function AppShell({
  user,
  onSignOut,
  isSigningOut = false,
  navigation,
  inboxCount = 0,
  children,
}: AppShellProps) {
  const [isNavOpen, { toggle: toggleNav, close: closeNav }] = useDisclosure(false);

  return (
    <MantineAppShell
      header={{ height: headerHeightPx }}
      navbar={{ width: 260, breakpoint: 'sm', collapsed: { mobile: !isNavOpen } }}
      padding={0}
    >
      <MantineAppShell.Header>
        <Group h="100%" px="md" justify="space-between" wrap="nowrap">
          <Group gap="sm" wrap="nowrap">
            <Burger opened={isNavOpen} onClick={toggleNav} hiddenFrom="sm" size="sm" aria-label="Toggle navigation" />
            <UnstyledButton
              component={Link}
              to={paths.projects.getHref()}
              onClick={closeNav}
              aria-label="Ladderwright home"
            >
              <Group gap={8} wrap="nowrap">
                <BrandMark />
                <Text fw={700} size="lg" lh={1}>
                  Ladderwright
                </Text>
              </Group>
            </UnstyledButton>
          </Group>
          <Group gap="xs" wrap="nowrap">
            <Group gap={4} wrap="nowrap" component="nav" aria-label="Sign-off mail">
              <Button
                component={Link}
                to={paths.inbox.getHref()}
                variant="subtle"
                size="compact-sm"
                aria-label={inboxCount > 0 ? `Inbox, ${inboxCount} waiting` : 'Inbox'}
                rightSection={
                  inboxCount > 0 ? (
                    <Badge size="sm" circle={inboxCount < 10} color="ember" variant="filled">
                      {inboxCount}
                    </Badge>
                  ) : undefined
                }
              >
                Inbox
              </Button>
              {user.role === 'admin' && (
                <Button component={Link} to={paths.outbox.getHref()} variant="subtle" size="compact-sm">
                  Outbox
                </Button>
              )}
              {user.role === 'admin' && (
                <Button component={Link} to={paths.accounts.getHref()} variant="subtle" size="compact-sm">
                  Admin
                </Button>
              )}
            </Group>
            <SchemeToggle />
            <UserMenu user={user} onSignOut={onSignOut} isSigningOut={isSigningOut} />
          </Group>
        </Group>
      </MantineAppShell.Header>
      <MantineAppShell.Navbar p="sm" aria-label="Project navigation" onClick={closeNav}>
        {navigation}
      </MantineAppShell.Navbar>
      <MantineAppShell.Main>
        <HvCaution />
        <Box p="lg">{children}</Box>
      </MantineAppShell.Main>
    </MantineAppShell>
  );
}

function SchemeToggle() {
  const { setColorScheme } = useMantineColorScheme();
  const computed = useComputedColorScheme('light', { getInitialValueInEffect: false });
  const next = computed === 'dark' ? 'light' : 'dark';
  const label = `Switch to ${next} scheme`;
  return (
    <Tooltip label={label}>
      <ActionIcon variant="subtle" color="gray" size="lg" aria-label={label} onClick={() => setColorScheme(next)}>
        {computed === 'dark' ? <SunGlyph /> : <MoonGlyph />}
      </ActionIcon>
    </Tooltip>
  );
}

interface UserMenuProps {
  user: CurrentUser;
  onSignOut: () => void;
  isSigningOut: boolean;
}

function UserMenu({ user, onSignOut, isSigningOut }: UserMenuProps) {
  return (
    <Menu position="bottom-end" width={240} withinPortal>
      <Menu.Target>
        <UnstyledButton aria-label={`Account: ${user.displayName}`}>
          <Group gap={8} wrap="nowrap">
            <Avatar size={30} radius="xl" color="verdigris" variant="filled">
              {initialsOf(user.displayName)}
            </Avatar>
            <div>
              <Text size="sm" fw={500} lh={1.2} visibleFrom="xs">
                {user.displayName}
              </Text>
              <Text size="xs" c="dimmed" lh={1.2} visibleFrom="xs">
                {user.role}
              </Text>
            </div>
          </Group>
        </UnstyledButton>
      </Menu.Target>
      <Menu.Dropdown>
        <Menu.Label>
          {user.displayName} · {user.role}
        </Menu.Label>
        <Menu.Item disabled>{user.email}</Menu.Item>
        <Menu.Item component={Link} to={paths.notificationSettings.getHref()}>
          Mail settings
        </Menu.Item>
        <Menu.Divider />
        <Menu.Item onClick={onSignOut} disabled={isSigningOut}>
          Sign out
        </Menu.Item>
      </Menu.Dropdown>
    </Menu>
  );
}

/** Two rails and three rungs: the mark beside the product name. */
function BrandMark() {
  return (
    <svg width="22" height="22" viewBox="0 0 22 22" aria-hidden="true">
      <rect width="22" height="22" rx="5" fill="var(--mantine-primary-color-filled)" />
      <path d="M7 4v14M15 4v14M7 7h8M7 11h8M7 15h8" stroke="white" strokeWidth="1.8" strokeLinecap="round" />
    </svg>
  );
}

/** An 18 px line icon on a 24-unit grid, drawn in the current text colour. */
function LineGlyph({ children }: { children: ReactNode }) {
  return (
    <svg
      width="18"
      height="18"
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth="1.8"
      aria-hidden="true"
    >
      {children}
    </svg>
  );
}

function MoonGlyph() {
  return (
    <LineGlyph>
      <path d="M20 14.5A8 8 0 0 1 9.5 4a8 8 0 1 0 10.5 10.5z" />
    </LineGlyph>
  );
}

function SunGlyph() {
  return (
    <LineGlyph>
      <circle cx="12" cy="12" r="4" />
      <path d="M12 2v2M12 20v2M4.9 4.9l1.4 1.4M17.7 17.7l1.4 1.4M2 12h2M20 12h2M4.9 19.1l1.4-1.4M17.7 6.3l1.4-1.4" />
    </LineGlyph>
  );
}

import type { Href } from 'expo-router';
import type { Role } from '@/shared/schemas/auth';
import {
  BriefingIcon,
  IncidentIcon,
  LibraryIcon,
  MailIcon,
  PeopleIcon,
  PersonIcon,
  PlanIcon,
  SightlineIcon,
  SweepIcon,
  TowerIcon,
  TrainingIcon,
  type IconProps,
} from '@/components/ui/icons';

export interface NavItem {
  href: Href;
  /** Path prefix that marks the item active. */
  match: string;
  label: string;
  Icon: (p: IconProps) => React.ReactElement;
  roles?: Role[];
}

export const NAV_ITEMS: NavItem[] = [
  { href: '/', match: '/', label: 'Sites', Icon: TowerIcon },
  { href: '/check', match: '/check', label: 'Quick check', Icon: SightlineIcon },
  { href: '/briefing', match: '/briefing', label: 'My watch', Icon: BriefingIcon, roles: ['observer'] },
  { href: '/plans', match: '/plans', label: 'Plans', Icon: PlanIcon, roles: ['planner', 'reviewer', 'observer'] },
  { href: '/library', match: '/library', label: 'Library', Icon: LibraryIcon, roles: ['planner', 'reviewer'] },
  {
    href: '/incidents',
    match: '/incidents',
    label: 'Incidents',
    Icon: IncidentIcon,
    roles: ['planner', 'reviewer', 'observer'],
  },
  {
    href: '/search-effort',
    match: '/search-effort',
    label: 'Search effort',
    Icon: SweepIcon,
    roles: ['planner', 'reviewer', 'observer'],
  },
  { href: '/training', match: '/training', label: 'Training', Icon: TrainingIcon, roles: ['planner', 'observer'] },
  { href: '/admin/users', match: '/admin/users', label: 'Users', Icon: PeopleIcon, roles: ['admin'] },
  { href: '/admin/mail', match: '/admin/mail', label: 'Mail', Icon: MailIcon, roles: ['admin'] },
  { href: '/account', match: '/account', label: 'Account', Icon: PersonIcon },
];

export function isActive(item: NavItem, pathname: string) {
  return item.match === '/' ? pathname === '/' || pathname.startsWith('/sites') : pathname.startsWith(item.match);
}

/** Places a phone's bottom bar holds before the rest go under "More": five fit 390 px with one-line labels. */
export const PHONE_BAR_SLOTS = 5;

/**
 * A phone's bottom bar: all the items when they fit, otherwise the first
 * `slots − 1` and the rest for the "More" list (the bar's last slot).
 */
export function phoneBarItems(items: readonly NavItem[], slots = PHONE_BAR_SLOTS): { bar: NavItem[]; more: NavItem[] } {
  if (items.length <= slots) return { bar: [...items], more: [] };
  return { bar: items.slice(0, slots - 1), more: items.slice(slots - 1) };
}

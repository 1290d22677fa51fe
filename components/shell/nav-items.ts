import type { Href } from 'expo-router';
import type { Role } from '@/shared/schemas/auth';
import {
  BriefingIcon,
  LibraryIcon,
  MailIcon,
  PeopleIcon,
  PersonIcon,
  PlanIcon,
  SightlineIcon,
  SweepIcon,
  TowerIcon,
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
    href: '/search-effort',
    match: '/search-effort',
    label: 'Search effort',
    Icon: SweepIcon,
    roles: ['planner', 'reviewer', 'observer'],
  },
  { href: '/admin/users', match: '/admin/users', label: 'Users', Icon: PeopleIcon, roles: ['admin'] },
  { href: '/admin/mail', match: '/admin/mail', label: 'Mail', Icon: MailIcon, roles: ['admin'] },
  { href: '/account', match: '/account', label: 'Account', Icon: PersonIcon },
];

export function isActive(item: NavItem, pathname: string) {
  return item.match === '/' ? pathname === '/' || pathname.startsWith('/sites') : pathname.startsWith(item.match);
}

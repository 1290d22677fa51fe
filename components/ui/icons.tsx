import Svg, { Circle, Line, Path, Polyline, Rect } from 'react-native-svg';
import { colors } from './theme';

export interface IconProps {
  size?: number;
  color?: string;
}

/**
 * Kenning's own line icons, drawn on a 24-unit grid with a 1.8 stroke and
 * square ends — the shape language of a surveyor's sketch.
 */
function Frame({ size = 24, color = colors.ink, children }: IconProps & { children: React.ReactNode }) {
  return (
    <Svg
      width={size}
      height={size}
      viewBox="0 0 24 24"
      fill="none"
      stroke={color}
      strokeWidth={1.8}
      strokeLinecap="square"
      strokeLinejoin="miter"
      aria-hidden
    >
      {children}
    </Svg>
  );
}

/** Home: a lookout tower on a rise. */
export function TowerIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M3 21c3-3 15-3 18 0" />
      <Path d="M9 18 10.5 9h3L15 18" />
      <Rect x="8.5" y="5" width="7" height="4" />
      <Path d="M12 5V3" />
    </Frame>
  );
}

/** Quick check: a sight line grazing the curve of the earth. */
export function SightlineIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M2 19c5-4 15-4 20 0" />
      <Line x1="4" y1="7" x2="21" y2="14" />
      <Circle cx="4" cy="7" r="1.6" />
    </Frame>
  );
}

/** Sites: a boundary with posts. */
export function SitesIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Polyline points="4,6 11,3 20,7 18,19 6,20 4,6" />
      <Circle cx="10" cy="10" r="1.5" />
      <Circle cx="15" cy="14" r="1.5" />
    </Frame>
  );
}

/** Account: a person with a horizon behind. */
export function PersonIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Circle cx="12" cy="8" r="3.5" />
      <Path d="M5 20c1-4 4-6 7-6s6 2 7 6" />
    </Frame>
  );
}

/** Users: two people. */
export function PeopleIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Circle cx="9" cy="8.5" r="3" />
      <Path d="M3 19c.8-3.3 3.2-5 6-5s5.2 1.7 6 5" />
      <Path d="M15.5 5.8a3 3 0 0 1 0 5.4M17.5 14.3c1.7.8 2.9 2.4 3.5 4.7" />
    </Frame>
  );
}

/** Caution: a triangle with a bar. */
export function CautionIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M12 3 22 20H2Z" />
      <Line x1="12" y1="9" x2="12" y2="14" />
      <Line x1="12" y1="17" x2="12" y2="17.2" />
    </Frame>
  );
}

/** Library: a target board on a stand. */
export function LibraryIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Circle cx="12" cy="9" r="6" />
      <Circle cx="12" cy="9" r="2" />
      <Line x1="12" y1="15" x2="12" y2="21" />
      <Line x1="8" y1="21" x2="16" y2="21" />
    </Frame>
  );
}

/** Search effort: parallel search legs joined at their ends. */
export function SweepIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Polyline points="4,4 4,20 10,20 10,4 16,4 16,20 20,20" />
    </Frame>
  );
}

/** Training: a sight line from an eye to a mark standing over the horizon arc. */
export function TrainingIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M2 19c6-3 14-3 20 0" />
      <Circle cx="5" cy="9" r="2" />
      <Line x1="7" y1="9" x2="19" y2="12" />
      <Line x1="19" y1="7" x2="19" y2="16" />
    </Frame>
  );
}

/** Plans: a folded sheet with two sight lines crossing on it. */
export function PlanIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M5 3h10l4 4v14H5z" />
      <Line x1="8" y1="17" x2="16" y2="10" />
      <Line x1="8" y1="10" x2="16" y2="17" />
    </Frame>
  );
}

/** Briefing: a post's flag over a horizon arc. */
export function BriefingIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M3 20c4-3 14-3 18 0" />
      <Line x1="9" y1="18" x2="9" y2="4" />
      <Path d="M9 4h9l-2.5 3L18 10H9" />
    </Frame>
  );
}

/** Incidents: two bearings crossing over a rising smoke. */
export function IncidentIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Line x1="3" y1="21" x2="14" y2="6" />
      <Line x1="21" y1="21" x2="10" y2="6" />
      <Path d="M12 11c-2-2 1-3-1-6" />
      <Path d="M3 21h18" />
    </Frame>
  );
}

/** Mail: an envelope whose flap is a horizon line. */
export function MailIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Rect x="3" y="6" width="18" height="13" />
      <Polyline points="3,7 12,13 21,7" />
    </Frame>
  );
}

export function SignOutIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M14 4H5v16h9" />
      <Line x1="10" y1="12" x2="21" y2="12" />
      <Polyline points="17,8 21,12 17,16" />
    </Frame>
  );
}

export function OfflineIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Path d="M2 9c5.5-5 14.5-5 20 0M5.5 12.5c3.6-3 9.4-3 13 0M9 16c1.7-1.3 4.3-1.3 6 0" />
      <Line x1="3" y1="3" x2="21" y2="21" />
    </Frame>
  );
}

/** More: the rest of the places, three marks in a row. */
export function MoreIcon(p: IconProps) {
  return (
    <Frame {...p}>
      <Rect x="3.5" y="10.5" width="3" height="3" />
      <Rect x="10.5" y="10.5" width="3" height="3" />
      <Rect x="17.5" y="10.5" width="3" height="3" />
    </Frame>
  );
}

import { NAV_ITEMS, PHONE_BAR_SLOTS, phoneBarItems } from '@/components/shell/nav-items';
import type { Role } from '@/shared/schemas/auth';

const itemsFor = (role: Role) => NAV_ITEMS.filter((i) => !i.roles || i.roles.includes(role));

// common practice, no source: a phone's bottom bar holds three to five places; the rest go under one entry.
describe('the phone bar', () => {
  test.each(['planner', 'reviewer', 'observer', 'admin'] as const)(
    'the %s role gets at most five slots and keeps every place',
    (role) => {
      const items = itemsFor(role);
      const { bar, more } = phoneBarItems(items);
      expect(bar.length + (more.length > 0 ? 1 : 0)).toBeLessThanOrEqual(PHONE_BAR_SLOTS);
      expect([...bar, ...more].map((i) => i.label)).toEqual(items.map((i) => i.label));
    },
  );

  test('five places or fewer all stay on the bar, with no "More"', () => {
    const five = NAV_ITEMS.slice(0, 5);
    expect(phoneBarItems(five)).toEqual({ bar: five, more: [] });
  });

  test('more than five places (a planner has eight): four on the bar, the rest under "More"', () => {
    const planner = itemsFor('planner').map((i) => i.label);
    expect(planner).toHaveLength(8);
    const { bar, more } = phoneBarItems(itemsFor('planner'));
    expect(bar.map((i) => i.label)).toEqual(planner.slice(0, 4));
    expect(more.map((i) => i.label)).toEqual(planner.slice(4));
  });
});

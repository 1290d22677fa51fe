import { render, screen } from '@testing-library/react';
import { Text } from 'react-native';
import { toggled } from '@/components/ui/chip';
import { FieldError } from '@/components/ui/field-error';
import { FieldRow } from '@/components/ui/field-row';

// The shared form parts behave as the copies they replaced did (common practice, no source).

describe('FieldError', () => {
  it('shows a message as an alert, and nothing without one', () => {
    const { rerender } = render(<FieldError message="Choose at least one post." />);
    expect(screen.getByRole('alert').textContent).toBe('Choose at least one post.');
    rerender(<FieldError message={undefined} />);
    expect(screen.queryByRole('alert')).toBeNull();
    rerender(<FieldError message="" />);
    expect(screen.queryByRole('alert')).toBeNull();
  });
});

describe('FieldRow', () => {
  it('gives each field its own share of the row, leaving out empty children', () => {
    const { container } = render(
      <FieldRow minWidth={140}>
        <Text>Pressure</Text>
        {null}
        {false}
        <Text>Temperature</Text>
      </FieldRow>,
    );
    const row = container.firstElementChild as HTMLElement;
    expect(row.children).toHaveLength(2);
    expect(screen.getByText('Pressure')).toBeTruthy();
    expect(screen.getByText('Temperature')).toBeTruthy();
    expect(getComputedStyle(row.children[0] as HTMLElement).minWidth).toBe('140px');
  });
});

describe('toggled', () => {
  it('adds a missing item at the end and takes out a present one, leaving the list it was given alone', () => {
    const list = ['a', 'b'];
    expect(toggled(list, 'c')).toEqual(['a', 'b', 'c']);
    expect(toggled(list, 'a')).toEqual(['b']);
    expect(list).toEqual(['a', 'b']);
  });
});

import { render, screen } from '@testing-library/react';
import { Text } from 'react-native';
import { hiddenSides, HorizontalScrollCue } from '@/components/ui/scroll-cue';

describe('hiddenSides', () => {
  it('says which sides hide content', () => {
    expect(hiddenSides(390, 390, 0)).toEqual({ left: false, right: false });
    expect(hiddenSides(390, 800, 0)).toEqual({ left: false, right: true });
    expect(hiddenSides(390, 800, 200)).toEqual({ left: true, right: true });
    expect(hiddenSides(390, 800, 410)).toEqual({ left: true, right: false });
  });
});

describe('HorizontalScrollCue', () => {
  it('shows no cue before it knows its size, and its children always', () => {
    render(
      <HorizontalScrollCue label="conditions">
        <Text>Horizon distance</Text>
      </HorizontalScrollCue>,
    );
    expect(screen.getByText('Horizon distance')).toBeTruthy();
    expect(screen.queryByRole('status')).toBeNull();
  });
});

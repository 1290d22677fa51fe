import type { PickedFile } from '@/components/data/terrain';
import { AppText } from '@/components/ui/app-text';

/** Whether files can be picked on this platform (the phone app does not upload terrain; the web app does). */
export const CAN_PICK_FILES = false;

/** Native stand-in for the web file chooser: terrain is uploaded from the web app. */
export function FilePickerField(_props: {
  label: string;
  buttonLabel: string;
  accept: string;
  file: PickedFile | null;
  error?: string;
  hint?: string;
  onPick: (file: PickedFile | null) => void;
}) {
  return (
    <AppText variant="small" tone="muted">
      Terrain files are uploaded from Kenning in a web browser.
    </AppText>
  );
}

import { deferredScreen } from '@/components/shell/deferred-screen';

const CalibrationScreen = deferredScreen('CalibrationScreen');

/** `/training/calibration`: k of the day from a field sighting. */
export default function CalibrationRoute() {
  return <CalibrationScreen />;
}

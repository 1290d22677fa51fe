import { deferredScreen } from '@/components/shell/deferred-screen';

const TrainingScreen = deferredScreen('TrainingScreen');

/** `/training`: due courses, practice drills; planners compose courses and read results. */
export default function TrainingRoute() {
  return <TrainingScreen />;
}

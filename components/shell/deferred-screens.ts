/**
 * The signed-in screens that are not needed for the first screen (sign-in or
 * the home), behind one module so that `deferredScreen` loads them as one async
 * chunk: the map (gestures, reanimated, projections), plans, sites, the quick
 * check, admin. One chunk on purpose: Metro's web export moves modules that two
 * async chunks share into `__common`, which index.html loads up front, so one
 * lazy import per screen would pull most of this back into the first load.
 */
export * as firstScreenSchemas from '@/components/data/first-screen-schemas';
export { AccountPanel } from '@/components/auth/account-panel';
export { SetPasswordForm } from '@/components/auth/set-password-form';
export { CaughtMailList } from '@/components/admin/caught-mail-list';
export { UserAdmin } from '@/components/admin/user-admin';
export { HistoryScreen } from '@/components/audit/history-screen';
export { BriefingScreen } from '@/components/briefing/briefing-screen';
export { FieldStatus } from '@/components/offline/field-status';
export { IncidentScreen } from '@/components/incidents/incident-screen';
export { IncidentsScreen } from '@/components/incidents/incidents-screen';
export { QuickCheck } from '@/components/check/quick-check';
export { LibraryScreen } from '@/components/library/library-screen';
export { SiteMapRouteContent } from '@/components/map/site-map-route';
export { EditPlanScreen } from '@/components/plans/edit-plan-screen';
export { PlanCompareScreen } from '@/components/plans/plan-compare-screen';
export { PlanEditor } from '@/components/plans/plan-editor';
export { PlanHistory } from '@/components/plans/plan-history';
export { PlanOverview } from '@/components/plans/plan-overview';
export { PlansScreen } from '@/components/plans/plans-screen';
export { ReviewPanel } from '@/components/plans/review-panel';
export { ReviewQueue } from '@/components/plans/review-queue';
export { VerifyPrintoutScreen } from '@/components/reports/verify-printout-screen';
export { SearchEffortScreen } from '@/components/search-effort/search-effort-screen';
export { NewSiteScreen } from '@/components/sites/new-site-screen';
export { PostEditor } from '@/components/sites/post-editor';
export { CrewCardScreen } from '@/components/reports/crew-card-screen';
export { SiteEditScreen } from '@/components/sites/site-edit-screen';
export { SiteOverview } from '@/components/sites/site-overview';
export { SitingScreen } from '@/components/siting/siting-screen';
export { TrainingScreen } from '@/components/trainer/training-screen';
export { AttemptScreen } from '@/components/trainer/attempt-screen';
export { CalibrationScreen } from '@/components/trainer/calibration-screen';

/**
 * The screens that run the forecast engine or draw a forecast, gathered in one module so the web
 * export makes them one chunk, fetched when the first of them opens. Metro moves any module that
 * two lazy chunks share into `__common`, which loads with the app: one chunk for all of them keeps
 * the engine (simulation/, odex), the chart and d3 out of the first load.
 */
export { PlanEditorScreen } from '@/components/plans/plan-editor-screen';
export { PrintPlanScreen } from '@/components/plans/print-plan-screen';
export { LessonScreen } from '@/components/lessons/lesson-screen';
export { LessonBuilderScreen } from '@/components/lessons/lesson-builder-screen';
export { SharedItemScreen } from '@/components/clubs/shared-item-screen';
export { SharedViewScreen } from '@/components/share/shared-view-screen';

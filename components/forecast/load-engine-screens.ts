/** The one place that fetches the forecast screens' chunk (see engine-screens.ts); routes wrap it in React.lazy. */
export const loadEngineScreens = () => import('./engine-screens');

import { fontFamilies } from '@/constants/theme';

/** Bundled TTFs (Atkinson Hyperlegible, SIL OFL 1.1: assets/fonts/OFL.txt), keyed by family name. */
export const fontSources = {
  [fontFamilies.regular]: require('../assets/fonts/atkinson-hyperlegible-400.ttf'),
  [fontFamilies.bold]: require('../assets/fonts/atkinson-hyperlegible-700.ttf'),
};

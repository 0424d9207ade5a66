// Imported for its effect, first in main.tsx and before uPlot in Chart.tsx: a language tag that Intl refuses
// (navigator.language === 'C' under the C locale) is replaced before any library reads it at load.
import { guardNavigatorLanguage } from './locale';

guardNavigatorLanguage();

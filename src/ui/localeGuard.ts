// Imported for its effect before uPlot, in Chart.tsx (the one module that loads it): a language tag that Intl
// refuses (navigator.language === 'C' under the C locale) is replaced before the library reads it at load.
// Not at start-up: the first use of Intl loads the browser's locale data, a long task on a phone, and nothing on
// the first screen needs it (our own formatting goes through deviceLocale(), which falls back by itself).
import { guardNavigatorLanguage } from './locale';

guardNavigatorLanguage();

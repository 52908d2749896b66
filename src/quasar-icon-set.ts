// Quasar's SVG icon set (quasar/icon-set/svg-mdi-v7) with only the parts of the components the app
// uses: the whole set put 90 icon paths (18 kB) into every page's first download, 20 are drawn
// (issue 14). Sections of components the app does not use (editor, carousel, colour picker, tree,
// uploader…; the same list src/css/quasar.sass leaves out) are empty, so nothing breaks if one is
// read. The same pictures as Quasar's own set, from src/icons.ts.
import type { QuasarIconSet } from 'quasar'
import {
  qIconArrowDown,
  qIconArrowLeft,
  qIconArrowRight,
  qIconArrowUp,
  qIconCheck,
  qIconChevronDown,
  qIconChevronLeft,
  qIconChevronRight,
  qIconChevronUp,
  qIconCloseCircle,
  qIconExclamation,
  qIconFieldError,
  qIconFirst,
  qIconInfo,
  qIconLast,
  qIconMenuDown,
  qIconNegative,
  qIconNow,
  qIconPositive,
  qIconToday,
} from './icons'

const used = {
  name: 'svg-mdi-v7',
  type: { positive: qIconPositive, negative: qIconNegative, info: qIconInfo, warning: qIconExclamation },
  arrow: {
    up: qIconArrowUp,
    right: qIconArrowRight,
    down: qIconArrowDown,
    left: qIconArrowLeft,
    dropdown: qIconMenuDown,
  },
  chevron: { left: qIconChevronLeft, right: qIconChevronRight },
  chip: { remove: qIconCloseCircle, selected: qIconCheck },
  datetime: { arrowLeft: qIconChevronLeft, arrowRight: qIconChevronRight, now: qIconNow, today: qIconToday },
  expansionItem: { icon: qIconChevronDown, denseIcon: qIconMenuDown },
  field: { clear: qIconCloseCircle, error: qIconFieldError },
  pagination: { first: qIconFirst, prev: qIconChevronLeft, next: qIconChevronRight, last: qIconLast },
  tabs: { left: qIconChevronLeft, right: qIconChevronRight, up: qIconChevronUp, down: qIconChevronDown },
  table: {
    arrowUp: qIconArrowUp,
    warning: qIconNegative,
    firstPage: qIconFirst,
    prevPage: qIconChevronLeft,
    nextPage: qIconChevronRight,
    lastPage: qIconLast,
  },
}
const unused = [
  'colorPicker',
  'pullToRefresh',
  'carousel',
  'editor',
  'fab',
  'rating',
  'stepper',
  'tree',
  'uploader',
]

export const iconSet = {
  ...Object.fromEntries(unused.map((k) => [k, {}])),
  ...used,
} as unknown as QuasarIconSet

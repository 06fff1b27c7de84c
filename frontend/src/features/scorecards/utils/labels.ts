import { POPULATION_LABELS, SPONSOR_TYPE_LABELS, type Mode } from '@veracast/shared-types';
import type { SPONSOR_FILTER_VALUES } from '../api/filters';

export const MODE_LABELS: Record<Mode, string> = {
  phone: 'Phone',
  ivr: 'Automated phone (IVR)',
  online: 'Online',
  text: 'Text message',
  mixed: 'Mixed modes',
  face: 'Face to face',
  mail: 'Mail',
};

export const SPONSOR_FILTER_LABELS: Record<(typeof SPONSOR_FILTER_VALUES)[number], string> = {
  ...SPONSOR_TYPE_LABELS,
  none: 'No sponsor type given',
};

export { POPULATION_LABELS };

// Crop names as a person reads them (the crop table in shared/domain/crops.ts holds the words).
import { cropKeys, crops, type CropKey } from '../domain/crops.js';
import { labelSet } from './label-set.js';

export const cropSet = labelSet<CropKey>(
  'crops',
  cropKeys,
  Object.fromEntries(crops.map((c) => [c.key, c.label])) as Record<CropKey, string>,
);

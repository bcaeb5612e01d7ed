// Protective devices on a link: breaker curves, adjustable breakers, time–current curves,
// devices with a stated trip current; and the RCD. Their fields are defined in schema.ts
// (DEVICE, under LINK) and checked with the link.

import * as schema from './schema.js';

export const DEVICE_TYPES = schema.DEVICE_TYPES;

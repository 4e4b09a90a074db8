import { z } from 'zod';
import { nameField, timeZoneField } from '$lib/server/auth/fields';

export const profileSchema = z.object({ name: nameField, timeZone: timeZoneField });

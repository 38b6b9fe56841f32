import { z } from 'zod';
import { isDecDms, isRaHms, PulsarName } from '../../../api/contracts/pulsar';

// The client checks a new pulsar with the API's own rules (api/contracts/pulsar.ts, shared by
// design) and words the messages for the form. The server stays the authority; its field errors
// land on the same fields.
export const CreatePulsarBody = z.object({
  name: z
    .string()
    .trim()
    .refine((v) => PulsarName.safeParse(v).success, 'Name: 1–32 letters, digits or + - _ (for example J1101-4417)'),
  raHms: z
    .string()
    .trim()
    .refine(isRaHms, 'Right ascension: use hh:mm:ss.s with hours 0–23, minutes and seconds below 60 (for example 11:01:07.43)'),
  decDms: z
    .string()
    .trim()
    .refine(isDecDms, 'Declination: use ±dd:mm:ss with degrees from −90 to +90, minutes and seconds below 60 (for example -44:17:21.9)'),
});
export type CreatePulsarBody = z.infer<typeof CreatePulsarBody>;

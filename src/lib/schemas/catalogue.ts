// The catalogue's fixed vocabularies: device types, regions, formats. Shared by server, islands and seed.
import { z } from 'zod';

export const deviceTypes = [
  'vcr',
  'dvd_recorder',
  'dvd_ram_recorder',
  'bluray_recorder',
  'vhs_dvd_combo',
  'camcorder',
  'cassette_deck',
  'cd_player',
  'minidisc',
] as const;
export const deviceTypeSchema = z.enum(deviceTypes);
export type DeviceType = z.infer<typeof deviceTypeSchema>;

export const deviceTypeLabels: Record<DeviceType, string> = {
  vcr: 'Video cassette recorder',
  dvd_recorder: 'DVD recorder',
  dvd_ram_recorder: 'DVD-RAM recorder',
  bluray_recorder: 'Blu-ray recorder',
  vhs_dvd_combo: 'VHS/DVD combination recorder',
  camcorder: 'Camcorder',
  cassette_deck: 'Cassette deck',
  cd_player: 'CD player',
  minidisc: 'MiniDisc machine',
};

export const regions = ['PAL', 'NTSC', 'SECAM', 'multi'] as const;
export const regionSchema = z.enum(regions);
export type Region = z.infer<typeof regionSchema>;

export const mediaFormats = [
  'VHS',
  'S-VHS',
  'VHS-C',
  'Betamax',
  'Video8',
  'Hi8',
  'Digital8',
  'MiniDV',
  'DVD-R',
  'DVD+R',
  'DVD-RW',
  'DVD-RAM',
  'BD-R',
  'CD',
  'CD-R',
  'Compact Cassette',
  'MiniDisc',
] as const;
export const mediaFormatSchema = z.enum(mediaFormats);
export type MediaFormat = z.infer<typeof mediaFormatSchema>;

/** Lower-case letters and digits only: "DV-4120K" and "dv 4120k" both become "dv4120k". */
export function normaliseCode(code: string): string {
  return code
    .normalize('NFKD')
    .toLowerCase()
    .replace(/[^a-z0-9]/g, '');
}

// All demo fixes in one list, gathered from the per-device-type files beside this one.
import type { DemoFix } from '../types';
import { camcorderFixes } from './camcorder';
import { cassetteDeckElectricsFixes } from './cassette-deck-electrics';
import { cassetteDeckTransportFixes } from './cassette-deck-transport';
import { cdPlayerOpticsFixes } from './cd-player-optics';
import { cdPlayerPowerFixes } from './cd-player-power';
import { comboDiscSideFixes } from './combo-disc-side';
import { comboFrontPanelFixes } from './combo-front-panel';
import { comboTapeSideFixes } from './combo-tape-side';
import { dvdRamDiscFixes } from './dvd-ram-disc';
import { dvdRamPowerFixes } from './dvd-ram-power';
import { dvdRecorderMechanismFixes } from './dvd-recorder-mechanism';
import { dvdRecorderOpticsFixes } from './dvd-recorder-optics';
import { dvdRecorderOutputFixes } from './dvd-recorder-outputs';
import { dvdRecorderPowerFixes } from './dvd-recorder-power';
import { miniDiscFixes } from './minidisc';
import { vcrMechanismFixes } from './vcr-mechanism';
import { vcrPowerFixes } from './vcr-power';
import { vcrTapePathFixes } from './vcr-tape-path';

export const demoFixes: DemoFix[] = [
  ...vcrMechanismFixes,
  ...vcrTapePathFixes,
  ...vcrPowerFixes,
  ...dvdRecorderMechanismFixes,
  ...dvdRecorderOpticsFixes,
  ...dvdRecorderPowerFixes,
  ...dvdRecorderOutputFixes,
  ...dvdRamDiscFixes,
  ...dvdRamPowerFixes,
  ...comboTapeSideFixes,
  ...comboDiscSideFixes,
  ...comboFrontPanelFixes,
  ...camcorderFixes,
  ...cassetteDeckTransportFixes,
  ...cassetteDeckElectricsFixes,
  ...cdPlayerOpticsFixes,
  ...cdPlayerPowerFixes,
  ...miniDiscFixes,
];

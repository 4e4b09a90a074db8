/**
 * Every circuit family, registered in one list. To add one: write `families/NAME.ts` exporting a
 * `Family`, and add it here.
 */
import { batteryLoad } from './battery-load';
import { charging } from './charging';
import { cranking } from './cranking';
import type { Family } from './family';
import { feedSideRelay } from './feed-side-relay';
import { groundSideRelay } from './ground-side-relay';
import { highResistanceFeed } from './high-resistance-feed';
import { indicatorLamp } from './indicator-lamp';
import { reversingMotor } from './reversing-motor';
import { sensorReference } from './sensor-reference';
import { seriesParallel } from './series-parallel';
import { sharedFuse } from './shared-fuse';
import { sharedGround } from './shared-ground';
import { switchInput } from './switch-input';
import { twoSpeedBlower } from './two-speed-blower';

export const FAMILIES: readonly Family[] = [
	feedSideRelay,
	groundSideRelay,
	sharedFuse,
	sharedGround,
	indicatorLamp,
	twoSpeedBlower,
	reversingMotor,
	sensorReference,
	switchInput,
	seriesParallel,
	highResistanceFeed,
	cranking,
	charging,
	batteryLoad
];

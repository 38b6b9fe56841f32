// The inversion is engine code (the search run uses it for its threshold line too); the explorer's panels import it from here.
export { powerAtFalseAlarm } from '../../../../../worker/timing/periodogram/false-alarm-power-level';

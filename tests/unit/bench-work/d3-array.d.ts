// Types for the two d3-array functions the chart tests compare against (the package ships none).
declare module 'd3-array' {
  export function ticks(start: number, stop: number, count: number): number[];
  export function tickStep(start: number, stop: number, count: number): number;
}

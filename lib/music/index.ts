// Pedalpoint's music core: chord symbols, keys, instruments, transposition and analysis.
export * from "./chord";
export * from "./qualities";
export * from "./keys";
export * from "./instruments";
export * from "./transpose";
export * from "./roman";
export * from "./progressions";

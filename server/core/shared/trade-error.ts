// The one error type of the trade library: bad input to a trade function,
// in plain words. The engine adds the function's name and the call's place.
export class TradeError extends Error {}

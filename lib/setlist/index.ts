// Set lists, each tune's arrangement for the gig, shares for subs and personal marks. Pure.
export * from "./model";
export * from "./validate";
export * from "./marks";
export * from "./share";
export * from "./share-mail";
export * from "./duration";

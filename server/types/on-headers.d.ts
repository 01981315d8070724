declare module 'on-headers' {
  import type { ServerResponse } from 'node:http';
  /** Calls `listener` (with the response as `this`) just before the response writes its headers. */
  export default function onHeaders<R extends ServerResponse>(res: R, listener: (this: R) => void): void;
}

/** The part of http_ece (RFC 8188 / RFC 8291 content encoding) the tests use to read push payloads. */
declare module 'http_ece' {
  import type { ECDH } from 'node:crypto';
  interface Params {
    version: 'aes128gcm' | 'aesgcm' | 'aesgcm128';
    privateKey?: ECDH;
    authSecret?: Buffer | string;
    dh?: Buffer | string;
    keyid?: Buffer | string;
  }
  export function decrypt(buffer: Buffer, params: Params): Buffer;
  export function encrypt(buffer: Buffer, params: Params): Buffer;
}

// The parts of http_ece (RFC 8188 / 8291 reference implementation) the push fake uses.
declare module "http_ece" {
  interface EceParams {
    version: "aes128gcm" | "aesgcm";
    privateKey?: import("node:crypto").ECDH;
    dh?: string;
    authSecret?: string;
    salt?: string;
  }
  const ece: {
    encrypt(buffer: Buffer, params: EceParams): Buffer;
    decrypt(buffer: Buffer, params: EceParams): Buffer;
  };
  export default ece;
}

export const S3_CLIENT = Symbol('S3_CLIENT');

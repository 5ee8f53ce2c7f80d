import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { ServerConfig } from '../config';
import { unauthorized } from '../http/HttpError';

const AUDIENCE = 'gluefield-api';

/** Short-lived HS256 access tokens carrying only the user id; roles are read fresh on every request. */
export class AccessTokens {
  /** Made once: given a string, jsonwebtoken first tries (and fails) to parse it as a PEM key on every call, which costs more than the HMAC. */
  private readonly key: KeyObject;

  constructor(private readonly config: ServerConfig['jwt']) {
    this.key = createSecretKey(Buffer.from(config.secret, 'utf8'));
  }

  get ttlSeconds(): number {
    return this.config.accessTtlSeconds;
  }

  sign(userId: string): string {
    return jwt.sign({}, this.key, {
      algorithm: 'HS256',
      subject: userId,
      issuer: this.config.issuer,
      audience: AUDIENCE,
      expiresIn: this.config.accessTtlSeconds,
    });
  }

  /** The user id of a valid token; 401 for a tampered, expired or foreign one. */
  verify(token: string): string {
    try {
      const payload = jwt.verify(token, this.key, { algorithms: ['HS256'], issuer: this.config.issuer, audience: AUDIENCE });
      if (typeof payload === 'string' || typeof payload.sub !== 'string') throw new Error('no subject');
      return payload.sub;
    } catch (error) {
      throw unauthorized(error instanceof jwt.TokenExpiredError ? 'the access token has expired' : 'the access token is not valid');
    }
  }
}

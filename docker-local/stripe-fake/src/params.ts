/**
 * Reads a parsed form body the way Stripe validates it: typed values, Stripe's
 * bracketed names in error messages, and an error for any parameter the
 * endpoint does not take (Stripe rejects those too).
 */
import { parameterInvalid, parameterMissing, parameterUnknown } from './errors.ts';
import { asList, paramName, type Param, type ParamMap } from './form-params.ts';
import type { Metadata } from './types.ts';

/** Stripe's documented metadata limits: 50 keys, 40-character keys, 500-character values. */
const METADATA_MAX_KEYS = 50;
const METADATA_MAX_KEY_LENGTH = 40;
const METADATA_MAX_VALUE_LENGTH = 500;

interface StringRule {
  required?: boolean;
  maxLength?: number;
}

interface IntegerRule {
  required?: boolean;
  min?: number;
  max?: number;
}

export class ParamReader {
  private readonly used = new Set<string>();
  private readonly children: ParamReader[] = [];

  constructor(
    private readonly map: ParamMap,
    private readonly path: readonly string[] = [],
  ) {}

  name(key: string): string {
    return paramName([...this.path, key]);
  }

  private take(key: string): Param | undefined {
    this.used.add(key);
    return this.map[key];
  }

  /** Empty strings count as absent: the SDK sends `key=` for null. */
  string(key: string, rule: StringRule & { required: true }): string;
  string(key: string, rule?: StringRule): string | undefined;
  string(key: string, rule: StringRule = {}): string | undefined {
    const value = this.take(key);
    if (value === undefined || value === '') {
      if (rule.required) throw parameterMissing(this.name(key));
      return undefined;
    }
    if (typeof value !== 'string') {
      throw parameterInvalid(this.name(key), `Invalid string: ${this.name(key)} must be a string, not a hash.`);
    }
    if (rule.maxLength !== undefined && value.length > rule.maxLength) {
      throw parameterInvalid(
        this.name(key),
        `Invalid string: ${this.name(key)} must be at most ${rule.maxLength} characters long.`,
      );
    }
    return value;
  }

  integer(key: string, rule: IntegerRule & { required: true }): number;
  integer(key: string, rule?: IntegerRule): number | undefined;
  integer(key: string, rule: IntegerRule = {}): number | undefined {
    const text = this.string(key, { required: rule.required ?? false });
    if (text === undefined) return undefined;
    if (!/^-?[0-9]{1,15}$/.test(text)) {
      throw parameterInvalid(this.name(key), `Invalid integer: ${text}`, 'parameter_invalid_integer');
    }
    const value = Number(text);
    if (rule.min !== undefined && value < rule.min) {
      throw parameterInvalid(this.name(key), `This value must be greater than or equal to ${rule.min}.`);
    }
    if (rule.max !== undefined && value > rule.max) {
      throw parameterInvalid(this.name(key), `This value must be less than or equal to ${rule.max}.`);
    }
    return value;
  }

  enumValue<T extends string>(key: string, allowed: readonly T[], rule: { required?: boolean } = {}): T | undefined {
    const value = this.string(key, { required: rule.required ?? false });
    if (value === undefined) return undefined;
    if (!(allowed as readonly string[]).includes(value)) {
      throw parameterInvalid(
        this.name(key),
        `Invalid ${this.name(key)}: must be one of ${allowed.join(', ')}`,
      );
    }
    return value as T;
  }

  hash(key: string, rule: { required?: boolean } = {}): ParamReader | undefined {
    const value = this.take(key);
    if (value === undefined || value === '') {
      if (rule.required) throw parameterMissing(this.name(key));
      return undefined;
    }
    if (typeof value === 'string') throw parameterInvalid(this.name(key), `Invalid object: ${this.name(key)} must be a hash.`);
    const child = new ParamReader(value, [...this.path, key]);
    this.children.push(child);
    return child;
  }

  list(key: string, rule: { required?: boolean } = {}): ParamReader[] | undefined {
    const value = this.take(key);
    if (value === undefined || value === '') {
      if (rule.required) throw parameterMissing(this.name(key));
      return undefined;
    }
    const items = typeof value === 'string' ? null : asList(value);
    if (items === null) throw parameterInvalid(this.name(key), `Invalid array: ${this.name(key)} must be an array.`);
    return items.map((item, index) => {
      const itemPath = [...this.path, key, String(index)];
      if (typeof item === 'string') {
        throw parameterInvalid(paramName(itemPath), `Invalid object: ${paramName(itemPath)} must be a hash.`);
      }
      const child = new ParamReader(item, itemPath);
      this.children.push(child);
      return child;
    });
  }

  stringList(key: string): string[] {
    const value = this.take(key);
    if (value === undefined || value === '') return [];
    const items = typeof value === 'string' ? null : asList(value);
    if (items === null || items.some((item) => typeof item !== 'string')) {
      throw parameterInvalid(this.name(key), `Invalid array: ${this.name(key)} must be an array of strings.`);
    }
    return items as string[];
  }

  metadata(key: string): Metadata {
    const value = this.take(key);
    if (value === undefined || value === '') return {};
    if (typeof value === 'string') throw parameterInvalid(this.name(key), `Invalid object: ${this.name(key)} must be a hash.`);
    const out: Metadata = {};
    for (const [metaKey, metaValue] of Object.entries(value)) {
      const name = paramName([...this.path, key, metaKey]);
      if (typeof metaValue !== 'string') throw parameterInvalid(name, `Invalid string: ${name} must be a string.`);
      if (metaKey.length > METADATA_MAX_KEY_LENGTH) {
        throw parameterInvalid(name, `Metadata keys can have up to ${METADATA_MAX_KEY_LENGTH} characters.`);
      }
      if (metaValue.length > METADATA_MAX_VALUE_LENGTH) {
        throw parameterInvalid(name, `Metadata values can have up to ${METADATA_MAX_VALUE_LENGTH} characters.`);
      }
      // An empty value unsets the key in Stripe; on a new object it is simply absent.
      if (metaValue !== '') out[metaKey] = metaValue;
    }
    if (Object.keys(out).length > METADATA_MAX_KEYS) {
      throw parameterInvalid(this.name(key), `You can have up to ${METADATA_MAX_KEYS} metadata keys.`);
    }
    return out;
  }

  /** Throws for the first parameter nobody read, here or in any nested hash. */
  done(): void {
    for (const key of Object.keys(this.map)) {
      if (!this.used.has(key)) throw parameterUnknown(this.name(key));
    }
    for (const child of this.children) child.done();
  }
}

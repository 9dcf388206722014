/**
 * `createZodDto` of nestjs-zod, with one correction to the OpenAPI metadata it hands to
 * @nestjs/swagger. zod writes a plain nullable (`z.number().nullable()`, `z.string().nullable()`)
 * as a JSON Schema type list, `{ type: ['number', 'null'] }`; swagger reads a list in a property's
 * `type` as "an array of the first type", so the document said `number[]` where the schema means
 * `number | null`. Each top-level property's type list is rewritten before swagger sees it: one
 * type plus null becomes that type with `nullable: true` (made the 3.1 `type: [T, 'null']` again by
 * openapi-finish.ts), several types become an `anyOf`. Nested schemas are not read by swagger and
 * need nothing. Use this, not nestjs-zod's own, for every DTO.
 */
import { createZodDto as createNestZodDto } from 'nestjs-zod';

type PropertyMetadata = Record<string, unknown>;

/** One property's metadata with a `type` list replaced by a single type (or an `anyOf`) and `nullable`. */
export function withoutTypeList(property: PropertyMetadata): PropertyMetadata {
  if (!Array.isArray(property.type)) return property;
  const types = property.type as unknown[];
  const members = types.filter((t): t is string => typeof t === 'string' && t !== 'null');
  const nullable = types.includes('null');
  const { type: _list, ...rest } = property;
  // An empty type is dropped by nestjs-zod's document clean-up (the property was already marked so).
  const out: PropertyMetadata = members.length === 1 ? { ...rest, type: members[0] } : { ...rest, type: '', anyOf: members.map((t) => ({ type: t })) };
  if (nullable) out.nullable = true;
  return out;
}

function fixMetadata(properties: unknown): unknown {
  if (!properties || typeof properties !== 'object') return properties;
  return Object.fromEntries(Object.entries(properties).map(([key, value]) => [key, value && typeof value === 'object' ? withoutTypeList(value as PropertyMetadata) : value]));
}

type Patchable = { _OPENAPI_METADATA_FACTORY(): unknown };

function patchFactory(dto: Patchable): void {
  const original = dto._OPENAPI_METADATA_FACTORY;
  Object.defineProperty(dto, '_OPENAPI_METADATA_FACTORY', {
    configurable: true,
    writable: true,
    value: function (this: Patchable) {
      return fixMetadata(original.call(this));
    },
  });
}

export const createZodDto: typeof createNestZodDto = (schema, options) => {
  const dto = createNestZodDto(schema, options);
  patchFactory(dto);
  // `Output` (the answer shape, a class made on each read) gets the same correction.
  const output = Object.getOwnPropertyDescriptor(dto, 'Output');
  if (output?.get) {
    const read = output.get;
    Object.defineProperty(dto, 'Output', {
      configurable: true,
      get(this: unknown) {
        const outputDto = read.call(this) as Patchable;
        patchFactory(outputDto);
        return outputDto;
      },
    });
  }
  return dto;
};

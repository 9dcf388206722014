import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { createZodDto, withoutTypeList } from './zod-dto.js';

const Schema = z.object({
  nextCursor: z.string().nullable(),
  windSpeedMps: z.number().min(0).nullable(),
  accessTagsChanged: z.boolean().nullable().default(null),
  tags: z.array(z.string()),
});

describe('DTO metadata for swagger', () => {
  it('gives a nullable property one type and nullable, never a type list swagger would read as an array', () => {
    for (const dto of [createZodDto(Schema), createZodDto(Schema).Output]) {
      const props = dto._OPENAPI_METADATA_FACTORY() as Record<string, Record<string, unknown>>;
      expect(props.nextCursor).toMatchObject({ type: 'string', nullable: true });
      expect(props.accessTagsChanged).toMatchObject({ type: 'boolean', nullable: true, default: null });
      expect(props.tags).toMatchObject({ type: 'array', items: { type: 'string' } });
      for (const p of Object.values(props)) expect(Array.isArray(p.type), JSON.stringify(p)).toBe(false);
    }
  });

  it('turns a list of several types into an anyOf', () => {
    expect(withoutTypeList({ type: ['string', 'number', 'null'], description: 'x' })).toEqual({ type: '', anyOf: [{ type: 'string' }, { type: 'number' }], nullable: true, description: 'x' });
    expect(withoutTypeList({ type: 'string' })).toEqual({ type: 'string' });
  });
});

/**
 * The one error body every failure answers with, so clients and scripts parse a single shape.
 */
import { Type, type Static } from '@sinclair/typebox';
import { ERROR_TABLE, type ErrorCode } from '../../shared/schema';

const ERROR_CODES = Object.keys(ERROR_TABLE) as ErrorCode[];

/** One located problem: JSON pointer (RFC 6901) into the request body, and what is wrong. */
export const FieldIssueSchema = Type.Object(
  {
    path: Type.String({ description: 'JSON pointer of the field at fault, e.g. /scenario/aquifer/storativity; "" = the whole body.' }),
    message: Type.String({ description: 'What is wrong with that field.' }),
  },
  { additionalProperties: false },
);

/** `{ error: { code, message, fix, issues? } }` — codes are stable; see ERROR_TABLE. */
export const ErrorResponseSchema = Type.Object(
  {
    error: Type.Object(
      {
        code: Type.Union(
          ERROR_CODES.map((c) => Type.Literal(c)),
          { description: 'Stable error code (DRYDIG_ERR_…); the meaning of a code never changes.' },
        ),
        message: Type.String({ description: 'What went wrong, naming the field where there is one.' }),
        fix: Type.String({ description: 'How to fix it.' }),
        issues: Type.Optional(Type.Array(FieldIssueSchema, { description: 'Every problem found, each located by a JSON pointer.' })),
      },
      { additionalProperties: false },
    ),
  },
  { additionalProperties: false, $id: 'DrydigErrorResponse', description: 'Every failure answers with this body.' },
);
export type ErrorResponse = Static<typeof ErrorResponseSchema>;

/** Number fields of result schemas (design, uncertainty, receptors, pumping-test fits), with their descriptions. */
import { Type } from '@sinclair/typebox';

export const Num = (description: string) => Type.Number({ description });
export const NullableNum = (description: string) => Type.Union([Type.Number(), Type.Null()], { description });

/** parseOptions: strict option parsing for the drydig commands. */
import { describe, expect, it } from 'vitest';
import { parseOptions } from '../../server/cli/parse-options';

const spec = { points: 'value', time: 'value', pretty: 'flag' } as const;

describe('parseOptions(args, spec)', () => {
  it('reads --name value, --name=value, flags and positionals', () => {
    expect(parseOptions(['s.json', '--points', '-5,3', '--time=7d', '--pretty'], spec, 'evaluate')).toEqual({
      positionals: ['s.json'],
      values: { points: '-5,3', time: '7d', pretty: 'true' },
    });
  });
  it('treats everything after -- as positionals', () => {
    expect(parseOptions(['--', '--points'], spec, 'evaluate').positionals).toEqual(['--points']);
  });
  const bad: Array<[string[], string]> = [
    [['--point', '1,2'], 'unknown option --point'],
    [['--points'], '--points needs a value'],
    [['--points='], '--points needs a value'],
    [['--time', '1', '--time', '2'], '--time is given more than once'],
    [['--pretty=yes'], '--pretty takes no value'],
    [['-p'], 'unknown option -p'],
  ];
  it.each(bad)('refuses %j', (args, says) => {
    expect(() => parseOptions(args, spec, 'evaluate')).toThrow(says);
  });
});

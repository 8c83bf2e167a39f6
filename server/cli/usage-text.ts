/** Help texts of the `drydig` command. */

export const USAGE = `drydig — construction-dewatering well-field designer

Usage:
  drydig evaluate SCENARIO.json --points "x,y;x,y" | --points FILE.csv [--time T] [--grid G] [--pretty | --csv]
  drydig design SCENARIO.json [--mode uniform|optimal|layout]
  drydig validate SCENARIO.json [--pretty]
  drydig pumping-test READINGS.csv --rate Q [--distance R] [--method M] [--stop T]
  drydig import FILE.ags | FILE.dxf [--borehole ID[,ID] --at x,y] [--unit M]
  drydig section FILE.json [--compare] [--flow-net] [--pretty | --csv]
  drydig serve [--port N] [--host H] [--data DIR] [--body-limit BYTES]
  drydig user add NAME [--role admin|designer|viewer] | list | disable NAME | enable NAME | reset NAME
  drydig backup DIR [--data DIR]
  drydig restore BACKUP_FILE [--data DIR]
  drydig help [COMMAND]
  drydig --version

Commands:
  evaluate   levels and drawdowns at points (and on a grid) as JSON on stdout
  design     pumping rates that meet each excavation's target level
  validate   check a scenario: errors naming the field, or warnings (accepted, probably not meant)
  pumping-test  aquifer parameters (T, S, B, well loss) fitted to a pumping test's readings
  import     what a site file holds: AGS boreholes (and a suggested ground profile), DXF layers
  section    seepage in a vertical section: flow, exit gradient, heave and uplift
  serve      start the web application and HTTP API (http://127.0.0.1:8080 by default)
  user       accounts of the service: add, list, disable, enable, reset
  backup     a consistent copy of the store while serving (write-ahead log included)
  restore    replace the store with a backup (stop the service first)

Exit codes: 0 done, 2 bad input (one line on stderr naming the problem), 1 unexpected error.
Results are estimates from idealised aquifer models; confirm them against site investigation,
local codes and a licensed engineer.
`;

export const EVALUATE_HELP = `drydig evaluate SCENARIO.json --points POINTS [--time T] [--grid G [--threads N]] [--pretty | --csv]

  SCENARIO.json   a scenario file (format drydig.scenario, version 1)
  --points P      inline "x,y;x,y" in site metres, or a CSV file: a header row naming
                  columns x and y (other columns ignored), or exactly two unnamed numeric
                  columns; comma, semicolon or tab separated
  --time T        seconds since pumping started (e.g. 604800), with an optional unit
                  (7d, 12h, 90min, 3600s), or "steady"; a comma list gives several times.
                  Default: the scenario's design time (steady state when that is null)
  --grid G        also evaluate a grid "x0,y0,dx,dy,nx,ny" (origin, spacing m, node counts)
  --threads N     worker threads that share a large grid by rows (default: all cores; 1: none).
                  The answer is the same to the last bit whatever N is
  --pretty        indent the JSON
  --csv           write the points as CSV (x,y,time_s,level_m,drawdown_m,flags) instead of
                  JSON; "# " comment lines carry the method and the cautions

Prints {"points":[{"x","y","time_s","level_m","drawdown_m","flags"}], "model", "models",
"cautions"}; one entry per point per time. Flags mark results outside a method's validity.
`;

export const SERVE_HELP = `drydig serve [--port N] [--host H] [--data DIR] [--body-limit BYTES] [--tile-origin URL]
             [--host-name NAME[,NAME…]]

  --port N           port to listen on (default: PORT, else 8080; 0 picks a free port)
  --host H           address to listen on (default: HOST, else 127.0.0.1)
  --data DIR         folder for stored scenarios (default: DRYDIG_DATA, else ./data)
  --body-limit B     largest request body accepted, bytes (default 8388608)
  --tile-origin URL  https origin of a map-tile server the page may load from
                     (default: DRYDIG_TILE_ORIGIN, else none)
  --host-name NAMES  host names the service answers for besides the bind address
                     and localhost (comma-separated; default: DRYDIG_HOST_NAMES);
                     requests naming another host get 421

Stops on Ctrl-C (SIGINT) or SIGTERM.
`;

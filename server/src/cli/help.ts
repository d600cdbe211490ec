/** `ionwright --help` and `ionwright <command> --help`. The examples run on the demo notes in examples/. */

const EXIT = `Exit status: 0 ran without error-severity findings, 1 ran with them, 2 usage or input problem
(one line on stderr), 141 the reader of the output went away early (as with '| head'; nothing more
is printed).`;

const FILES = `Files: folders are read recursively (hidden folders and node_modules skipped), each file once, in
sorted order. A path named on the command line is followed wherever it leads; inside a folder,
symbolic links are followed only to places inside that folder. Links that lead out of it, back to
what was already read, or nowhere are not followed, and one line on stderr says which (this does not
change the exit status; a link named like a note that leads nowhere is a file that cannot be read).
A file that cannot be read, or is skipped because it is not UTF-8 text (NUL bytes, UTF-16, invalid
bytes), is one line on stderr with the reason, and makes the exit status 2.`;

const CONTROLS = `Control characters in the notes or in file names are printed as pictures (ESC as ␛, CR as ␍,
BEL as ␇; C1 controls as \\x9b), never sent to the terminal as they are; JSON output escapes them
as JSON does.`;

export const OVERVIEW = `Ionwright: formulas, reactions and batch recipes in formulation notes
(Markdown .md/.markdown and .fnote files): molar masses, charge balance, balanced equations, batch arithmetic.

Usage: ionwright <command> [arguments] [flags]

Commands:
  ionwright card <formula>... [--json]        the card of each formula: molar mass, ions, charge balance, bonding
  ionwright check <path>... [flags]           the findings in notes files (folders are read recursively)
  ionwright merge-sarif <file.sarif>...       the SARIF logs of several check --shard jobs as one log
  ionwright balance "<equation>" [--json]     balance a reaction
  ionwright batch <path>... [--json]          the arithmetic of every batch block in notes files (folders too)
  ionwright table <path>...                   the Markdown tables the editor inserts, for notes files (folders too)
  ionwright report <path> [--html <out.html>] a self-contained HTML page: formulas and batches as tables, a chart of estimated lattice energies
  ionwright demo [<folder>]                   a tour of a folder of notes (default: examples)

Flags of check:
  --format text|json|sarif   text (default): 'file:line:col severity code message' lines and a summary;
                             json: an array of LSP diagnostics; sarif: SARIF 2.1.0 for code scanning
  --jobs <n>|auto            worker threads for many files: auto (default) uses them only for large
                             inputs on 4 or more cores, 1 checks in one thread, n > 1 up to n threads
  --shard <i>/<n>            only the i-th of n disjoint parts of the files, split by path (CI matrices)
Flags of card, balance and batch:
  --json                     JSON instead of text
Everywhere:
  -h, --help                 this overview; 'ionwright <command> --help' for one command
  --version                  the version

Environment:
  IONWRIGHT_JOBS=<n>|auto    as --jobs, when the flag is not given

${FILES}

${CONTROLS}

Examples (on the demo notes in examples/):
  ionwright check examples/
  ionwright check examples/ --format sarif > ionwright.sarif
  ionwright card CuSO4.5H2O "[Co(NH3)6]Cl3"
  ionwright balance "Fe2O3 + H3PO4 -> FePO4 + H2O"
  ionwright batch examples/plating-bath.fnote
  ionwright report examples/rinse-trials.md --html report.html

${EXIT}`;

const CHECK = `Usage: ionwright check <path>... [--format text|json|sarif] [--jobs <n>|auto] [--shard <i>/<n>]

The findings in Markdown (.md, .markdown) and notes (.fnote) files: unknown elements, unreadable
formulas, charge imbalances, unbalanced reactions, mistakes in batch blocks. Findings come in sorted
file order; all three formats are written as they go, so any number of findings can be printed.

Flags:
  --format text      'file:line:col severity code message' per finding (1-based line and column),
                     then one summary line (default)
  --format json      an array of {file, range, severity, code, message, source}: 0-based lines,
                     UTF-16 columns, severity 1 error, 2 warning, 3 info, 4 hint
  --format sarif     SARIF 2.1.0; file URIs relative to %SRCROOT%, the folder it runs in
  --jobs auto        (default) worker threads (one per core but one) on 4 or more cores, for at
                     least 8 files and 2 million characters; otherwise one thread
  --jobs 1           everything in one thread
  --jobs <n>         up to n worker threads, whatever the size of the input
  --shard <i>/<n>    only the files of the i-th of n disjoint parts (1 ≤ i ≤ n), so that n CI jobs
                     together check every file once; a file's part depends on its path relative to
                     the folder check runs in, so every job splits alike. Merge the jobs' SARIF
                     logs with 'ionwright merge-sarif'
  -h, --help         this help

Environment:
  IONWRIGHT_JOBS=<n>|auto   as --jobs, when the flag is not given

On a terminal, a progress line ('checking 12/40 files…') is drawn on stderr and wiped at the end.

${FILES} In SARIF, files not read are error notifications
(the run not successful) and links not followed are note notifications.

${CONTROLS}

Examples:
  ionwright check examples/
  ionwright check examples/rinse-trials.md --format json
  ionwright check examples/ --format sarif > ionwright.sarif
  ionwright check examples/ --jobs 2
  ionwright check examples/ --shard 1/2 --format sarif > shard-1.sarif
  ionwright check examples/ --shard 2/2 --format sarif > shard-2.sarif

${EXIT}`;

const MERGE_SARIF = `Usage: ionwright merge-sarif <file.sarif>...

The SARIF logs written by 'ionwright check --shard <i>/<n> --format sarif' in n jobs, printed as one
log with one run: every rule once, every result ordered by file as an unsharded check orders them, one
invocation per log (the run is successful only if every job's was). Upload that one log to a code
scanning service. Logs not written by Ionwright are refused.

Flags:
  -h, --help   this help

Examples (after the two --shard examples of 'ionwright check --help'):
  ionwright merge-sarif shard-1.sarif shard-2.sarif > ionwright.sarif

Exit status: 0 merged; 2 a file that cannot be read or is not an Ionwright SARIF 2.1.0 log (one line
on stderr).`;

const CARD = `Usage: ionwright card <formula>... [--json]

The card of each formula: the formula written out, Hill formula, molar mass, composition, oxidation
states, charge balance, the ions it reads as, bonding and lattice energy where they apply.

Flags:
  --json       one JSON object per formula
  -h, --help   this help

Examples:
  ionwright card CuSO4.5H2O
  ionwright card "SO4^2-" "[Co(NH3)6]Cl3" --json

${EXIT}`;

const BALANCE = `Usage: ionwright balance "<equation>" [--json]

Balances a reaction written reactants -> products (or with =, →, ⇌), charges included.

Flags:
  --json       the status, coefficients and differences as JSON
  -h, --help   this help

Examples:
  ionwright balance "Fe2O3 + H3PO4 -> FePO4 + H2O"
  ionwright balance "MnO4^- + Fe^2+ + H^+ -> Mn^2+ + Fe^3+ + H2O" --json

${EXIT}`;

const BATCH = `Usage: ionwright batch <path>... [--json]

The arithmetic of every batch block in notes files: what to weigh, moles, concentrations, mass
fractions, ions and ionic strength. A folder stands for every notes file in it, read as check reads it;
when the paths name more than one file, each file's part of the text starts with a '════ <file>' line.

Flags:
  --json       one array of all the batches, each with the file it is in ('file')
  -h, --help   this help

${FILES}

Examples:
  ionwright batch examples/plating-bath.fnote
  ionwright batch examples/rinse-trials.md --json

${EXIT}`;

const TABLE = `Usage: ionwright table <path>...

The Markdown tables the editor inserts for notes files: formulas by section and batches. A folder
stands for every notes file in it; when the paths name more than one file, each file's tables start
with a '════ <file>' line.

Flags:
  -h, --help   this help

${FILES}

Example:
  ionwright table examples/rinse-trials.md

${EXIT}`;

const REPORT = `Usage: ionwright report <path> [--html <out.html>]

A self-contained HTML page: formulas and batches as tables, a chart of estimated lattice energies.

The page holds no scripts and loads nothing: it can be mailed or archived as it is. Formulas, batches
and reactions as tables, a chart of the estimated lattice energies of the salts against 1/(r₊ + r₋)
with melting points where known, the findings, and (for Markdown) the notes as the preview shows them.

Flags:
  --html <out.html>   write the page to this file; without the flag (or with --html -) the page goes
                      to standard output
  -h, --help          this help

The page never replaces what you wrote: an output path that is the notes file read, a notes file
(.md, .markdown, .fnote), or a link to one is refused (exit 2). The file is written whole or not at
all: the page goes to a temporary file in the same folder, which then takes the name.

Examples:
  ionwright report examples/rinse-trials.md --html report.html
  ionwright report examples/rinse-trials.md > report.html

${EXIT}`;

const DEMO = `Usage: ionwright demo [<folder>]

A tour of a folder of notes (default: examples): the cards of its formulas, its findings and the
tables the editor would insert.

Flags:
  -h, --help   this help

Example:
  ionwright demo examples

${EXIT}`;

export const COMMAND_HELP: Record<string, string> = {
  card: CARD,
  check: CHECK,
  'merge-sarif': MERGE_SARIF,
  balance: BALANCE,
  batch: BATCH,
  table: TABLE,
  report: REPORT,
  demo: DEMO,
};

/** `--help` or `-h` among a command's arguments (before a `--` that ends the flags). */
export function asksForHelp(args: string[]): boolean {
  for (const a of args) {
    if (a === '--') return false;
    if (a === '--help' || a === '-h') return true;
  }
  return false;
}

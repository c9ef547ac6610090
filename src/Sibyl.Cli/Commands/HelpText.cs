using System.Globalization;
using System.Text;
using Sibyl.Cosmology.Parameters;
using Sibyl.Perturbation.Matter;
using Sibyl.Perturbation.RedshiftSpace;

namespace Sibyl.Cli.Commands;

/// <summary>Help texts; parameter lists come from the catalog so they never drift from the code.</summary>
internal static class HelpText
{
    public const string Usage = """
        usage: sibyl <command> [arguments]

        commands:
          quickstart [--folder DIR]                   the whole job on a built-in grid: plan, run, fit, check, serve
          compute linear [name=value ...] [options]   linear spectrum P_lin and its no-wiggle partner P_nw
          compute matter [name=value ...] [options]   one-loop real-space matter spectrum, IR-resummed
          compute galaxy [name=value ...] [options]   one-loop redshift-space galaxy multipoles P0, P2, P4
          plan SPEC [--out DESIGN]                    draw the training and held-out design of a grid spec
          run DESIGN [--shard I/N] [options]          compute the design's points on all cores, resumably
          merge DESIGN [FOLDER ...] [--out FILE]      join run folders (shards) into one training set
          fit TRAINING [options]                      fit a PCA + Gaussian-process emulator, validate it on held-out points
          check EMULATOR [options]                    compare an emulator with fresh direct runs in its box
          serve NAME=EMULATOR ... [options]           serve emulators to samplers over gRPC (protos/sibyl/v1)
          ask NAME [name=value ...] [options]         ask a running server for one point, CSV on stdout

        sibyl compute --help lists every parameter with its default, range and unit;
        sibyl plan|run|merge|fit|check|serve|ask --help describe their options. Grid specs: training-grids/README.md.
        """;

    public const string Plan = """
        usage: sibyl plan SPEC [--out DESIGN]

        Reads a grid spec (JSON; format in training-grids/README.md), checks it completely (every problem
        is listed, exit code 2), and draws a maximin-improved Latin hypercube of training points
        (McKay et al. 1979; Morris & Mitchell 1995) and a second, independent one of held-out points,
        reproducible from the spec's seed. Prints the design file's path on stdout.

        options:
          --out DESIGN   [NAME.design, NAME from the spec file name] where to write the design
          --help         this text
        """;

    public const string Run = """
        usage: sibyl run DESIGN [--out FOLDER] [--shard I/N] [--threads N] [--retry-failed]

        Computes every point of the design with the direct one-loop calculation, on all cores, and stores
        results in chunk files written atomically into FOLDER. Run it again after an interruption (kill,
        node failure, SIGTERM at a time limit) and it computes only the missing chunks. A point whose
        calculation fails is stored with its error and listed at the end (exit code 3).

        options:
          --out FOLDER    [DESIGN with .run instead of .design] run folder, shared by all shards
          --shard I/N     [0/1] compute only chunks c with c mod N = I (0 <= I < N), for a job array:
                          e.g. --shard $SLURM_ARRAY_TASK_ID/N with --array=0-(N-1); write N itself, since
                          resubmitting some tasks changes the array's task count (training-grids/slurm/)
          --threads N     [number of cores] worker threads
          --retry-failed  compute stored chunks with failed points again
          --help          this text

        exit codes: 0 done, 2 bad input, 3 some points failed, 130 interrupted (finished chunks kept)
        """;

    public const string Merge = """
        usage: sibyl merge DESIGN [FOLDER ...] [--out FILE]

        Joins the chunks of the run folders (default: DESIGN's .run folder) into one training set. Refuses,
        listing every problem, when chunks are missing (naming the shards to rerun), damaged, from another
        design or another build of Sibyl, or present twice with different contents.

        options:
          --out FILE   [DESIGN with .training instead of .design] the training set
          --help       this text
        """;

    public static string Compute()
    {
        var text = new StringBuilder();
        text.Append("""
            usage: sibyl compute linear|matter|galaxy [name=value ...] [options]

            Writes a CSV (header row, invariant culture, round-trip precision) to stdout or --out;
            growth D, f and sigma8 at z go to stderr. Units: k in h/Mpc, P in (Mpc/h)^3.

            parameters (name=value; defaults in brackets):
            """);
        text.Append('\n');
        foreach (var d in ParameterCatalog.All.Append(ParameterCatalog.Redshift))
        {
            Describe(text, d);
        }

        text.Append(CultureInfo.InvariantCulture, $"  {ParameterCatalog.ModelName,-11} [lcdm] one of {string.Join(", ", ParameterCatalog.Models.Keys)}\n");
        text.Append(CultureInfo.InvariantCulture, $"  {ParameterCatalog.LinearName,-11} [fit] one of {string.Join(", ", ParameterCatalog.LinearSources.Keys)}: the Eisenstein & Hu (1998) fitting formula,\n");
        text.Append("""
                          or the built-in Einstein-Boltzmann solver (about 0.3 s; the only source reading N_eff
                          and Y_He). compute linear linear=boltzmann adds the fit's P_lin and P_nw and the
                          ratio P_lin/P_lin_fit, and --plot draws the two against each other

            """);
        text.Append("\ncompute matter also takes:\n");
        Describe(text, MatterLayout.SoundSpeedDefinition);
        text.Append("\ncompute galaxy also takes (nuisance parameters):\n");
        foreach (var d in GalaxyLayout.Nuisance)
        {
            Describe(text, d);
        }

        text.Append(CultureInfo.InvariantCulture, $$"""

            options:
              --kmin K   [{{PointArguments.DefaultKMin:G}}] smallest output k, h/Mpc
              --kmax K   [{{PointArguments.DefaultKMax:G}}] largest output k, h/Mpc (matter and galaxy need k a factor
                         10 inside the linear table: [1e-4, 10] for the fit and the solver)
              --nk N     [{{PointArguments.DefaultKCount}}] number of log-spaced k values
              --table F  linear P(k) at z = 0 of the GR counterpart, two columns k, P (replaces linear=;
                         its amplitude replaces ln10As/sigma8; never extrapolated; loops integrate
                         over its range only, so give it a wide one, e.g. 1e-5 to 50 h/Mpc)
              --out F    write the CSV to F (atomically) instead of stdout
              --plot F   also write a PNG figure to F
              --basis    compute galaxy: also write every basis term (one column each)
              --help     this text

            exit codes: 0 done, 2 bad input, 5 the calculation failed (the message names the mode)

            """);
        return text.ToString();
    }

    private static void Describe(StringBuilder text, ParameterDefinition d)
    {
        string value = double.IsNaN(d.Default) ? "unset" : d.Default.ToString("G", CultureInfo.InvariantCulture);
        string unit = d.Unit.Length > 0 ? " " + d.Unit : "";
        text.Append(CultureInfo.InvariantCulture, $"  {d.Name,-11} [{value}{unit}] in {d.Range}: {d.Meaning}\n");
    }

    public const string Fit = """
        usage: sibyl fit TRAINING [--out EMULATOR] [--report PREFIX] [options]

        Fits an emulator of every basis term of the training set: per term (and redshift, when the grid lists
        fixed redshifts) ln of the term where it is positive everywhere, else the term over its RMS at k;
        principal components keeping the largest training reconstruction error below --pca-tolerance;
        Gaussian processes (Rasmussen & Williams 2006) with a polynomial trend for the component
        coefficients, hyperparameters by maximum marginal likelihood. Then compares it with the held-out
        points and writes the report: per-k error percentiles (50, 90, 99, max) for every term as text
        (PREFIX.txt) and figure (PREFIX.png), with the worst points named.

        options:
          --out EMULATOR       [TRAINING with .emulator] the emulator file
          --report PREFIX      [EMULATOR without extension, then -heldout] report files PREFIX.txt, PREFIX.png
          --kernel K           [matern52] matern52 or se (squared exponential); ARD length scales
          --separate N         [1] leading components of each term with a Gaussian process of their own;
                               the rest share one (0: one process per term, fastest to predict; more:
                               slower, slightly more accurate)
          --trend N            [2] degree of the polynomial trend (0, 1, 2)
          --pca-tolerance E    [1e-4] largest reconstruction error (ln units, or RMS units for signed terms)
          --hyper-points N     [400] training points used to optimise hyperparameters (all are conditioned on)
          --restarts N         [2] optimiser restarts
          --variance           keep the Cholesky factors so that predictive variances are available
                               (n^2 numbers per process: 32 MB each at 2000 training points)
          --threads N          [number of cores] processes fitted in parallel
          --help               this text
        """;

    public const string Check = """
        usage: sibyl check EMULATOR [--points N] [--seed S] [--report PREFIX] [--max-error E]

        Draws N fresh points in the emulator's box (a new Latin hypercube, neither training nor held-out),
        runs the direct calculation there on all cores and compares: the same report as sibyl fit. This is
        how to decide whether to trust an emulator before publishing with it.

        options:
          --points N      [50] fresh points
          --seed S        [derived from the grid's seed] seed of the fresh points
          --report PREFIX [EMULATOR without extension, then -check] report files PREFIX.txt, PREFIX.png
          --max-error E   exit with code 4 if any term's 99th-percentile error at k <= 0.3 h/Mpc exceeds E
                          (a fraction: 0.001 is 0.1 %)
          --threads N     [number of cores] threads for the direct calculation
          --help          this text
        """;

    public const string Quickstart = """
        usage: sibyl quickstart [--folder DIR] [--threads N] [--port P] [--no-serve]

        The whole job on the built-in grid (training-grids/quickstart.json: the one-loop matter spectrum over
        an invented nDGP box of omega_cdm, ln10As, z and Omega_rc): plans a Latin-hypercube design, computes
        it on all cores, merges, fits a PCA + Gaussian-process emulator, validates it on held-out points and on
        fresh direct runs, prints the measured accuracy, then serves the emulator over gRPC on loopback as
        'quickstart' until Ctrl-C. A few minutes on 2 cores. Everything stays in DIR; a second run reuses
        what is already built.

        options:
          --folder DIR   [sibyl-quickstart] work folder
          --threads N    [number of cores] worker threads
          --port P       [50051] port of the server (0: a free one, printed)
          --no-serve     stop after the check instead of serving
          --help         this text
        """;

    public const string Serve = """
        usage: sibyl serve NAME=EMULATOR ... [--host H] [--port P] [--max-batch N] [--max-message-bytes N]

        Serves emulator files (from sibyl fit) under the given names over gRPC (HTTP/2 without TLS; the contract
        is protos/sibyl/v1/emulator.proto), with standard gRPC health checking and server reflection. Prints one
        line on stdout saying where it listens and each emulator's measured accuracy; logs go to stderr.
        Ctrl-C or SIGTERM stops it after the calls in flight (at most 5 s).

        options:
          --host H               [127.0.0.1] address to bind: loopback only by default, as the server has no
                                 authentication; 0.0.0.0 exposes it to the network
          --port P               [50051] TCP port; 0 picks a free one (printed)
          --max-batch N          [10000] most points in one batch call (more: RESOURCE_EXHAUSTED)
          --max-message-bytes N  [67108864] largest request or reply, bytes
          --max-k N              [10000] most requested k values per point (more: INVALID_ARGUMENT)
          --verbose              log every refused request on stderr
          --help                 this text
        """;

    public const string Ask = """
        usage: sibyl ask NAME [name=value ...] [--server URL] [--z Z] [--k K1,K2,...] [options]

        Asks a running sibyl serve for one point of emulator NAME and writes a CSV (invariant culture,
        round-trip precision): k, each observable, then with --basis each basis term, with --variance
        var_<series>, with --gradient d<series>/d<parameter>. name=value sets an input parameter or a nuisance
        parameter (missing nuisance parameters count as 0). Units: k in h/Mpc, P in (Mpc/h)^3.

        options:
          --server URL    [http://127.0.0.1:50051] the server
          --z Z           redshift, for emulators trained at fixed redshifts (one of them)
          --k K1,K2,...   wavenumbers inside the emulator's k range, h/Mpc [the emulator's grid]
          --basis         also every basis term
          --variance      also the emulator's predictive variances
          --gradient      also d/d(parameter) of every series
          --extrapolate   allow a point slightly outside the box (warned on stderr)
          --timeout S     [30] seconds before giving up
          --help          this text

        exit codes: 0 done, 2 refused (the message names the parameter and its range), 1 server unreachable
        """;
}

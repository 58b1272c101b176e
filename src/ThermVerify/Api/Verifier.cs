using ThermVerify.Baselines;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Limits;
using ThermVerify.Tolerances;

namespace ThermVerify.Api;

/// <summary>
/// The front door of the library: one call per job, each taking a validated design and an options record and
/// returning a result that the renderers in <c>ThermVerify.Reporting</c> turn into text, JSON, JUnit or a report.
/// The command-line tool is a thin shell around these calls; a program that embeds thermverify calls them too.
/// Nothing here prints or writes files.
/// </summary>
public static class Verifier
{
    /// <summary>Reads and validates a design file; a <see cref="DesignException"/> names the file, line, key and fix.</summary>
    /// <param name="limits">Bounds on file sizes and sweep points (docs/design-file.md); the defaults when null.</param>
    public static FrontEndDesign LoadDesign(string path, WorkLimits? limits = null)
    {
        using var scope = limits is null ? null : Work.Scope(CancellationToken.None, limits);
        return DesignLoader.Load(path);
    }

    /// <summary>
    /// A starting design file for a SPICE netlist (docs/netlists.md): the netlist read strictly, its sensor, pin,
    /// excitation and reference guessed and marked CONFIRM, the rest placeholders marked FILL IN. The design file is to
    /// lie in the netlist's folder; includes are read from there.
    /// </summary>
    public static string ImportNetlist(string netlistPath, WorkLimits? limits = null)
    {
        using var scope = limits is null ? null : Work.Scope(CancellationToken.None, limits);
        return Design.Netlists.NetlistImportFile.Read(netlistPath);
    }

    /// <summary>
    /// The main job: the design's closed form against simulation over its check range, every error against the
    /// budget, with findings and proven remedies; compared with a baseline file when one is named.
    /// </summary>
    public static CheckRun Check(FrontEndDesign design, CheckOptions? options = null, string? baselinePath = null)
    {
        var baseline = baselinePath is null ? null : BaselineFile.Read(baselinePath); // a bad baseline is refused before the work
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        var result = FrontEndCheck.Run(design, options);
        var provenance = RunStamp.Check(design, options);
        var comparison = baseline is null ? null
            : BaselineComparison.Compare(baselinePath!, baseline, BaselineFigures.From(result, provenance));
        return new CheckRun(result, provenance, comparison);
    }

    /// <summary>Two designs checked alike (an unbuffered and a buffered one, two op-amps).</summary>
    public static DesignPair Compare(FrontEndDesign first, FrontEndDesign second, CheckOptions? options = null)
    {
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        var (a, b) = (FrontEndCheck.Run(first, options), FrontEndCheck.Run(second, options));
        return new(a, b, RunStamp.Check(first, options), RunStamp.Check(second, options));
    }

    /// <summary>Checks the design (remedies off) and returns the key figures a later check compares with, with the run's provenance.</summary>
    public static (Baseline Baseline, CheckResult Result) MakeBaseline(FrontEndDesign design, CheckOptions? options = null)
    {
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        var checkOptions = (options ?? new CheckOptions()) with { ComputeRemedies = false };
        var result = FrontEndCheck.Run(design, checkOptions);
        return (BaselineFigures.From(result, RunStamp.Check(design, checkOptions)), result);
    }

    /// <summary>
    /// Extreme values over the tolerance box (each corner verified in full) and root-sum-square; when it fails, the
    /// reference resistor's tolerance or tempco a ratiometric current source needs, proven by the worst case of the changed design.
    /// </summary>
    public static WorstCaseResult WorstCase(FrontEndDesign design, WorstCaseOptions? options = null)
    {
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        options ??= new WorstCaseOptions();
        return ReferenceResistorRemedies.Attach(design, Tolerances.WorstCase.Run(design, options), options);
    }

    /// <summary>Units built with random parts within their tolerances, each verified: envelope, yield, contributors.</summary>
    public static MonteCarloResult MonteCarlo(FrontEndDesign design, MonteCarloOptions? options = null)
    {
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        return Tolerances.MonteCarlo.Run(design, options);
    }

    /// <summary>The values of an E-series as the divider's fixed resistor, ranked by the objective.</summary>
    public static IReadOnlyList<FixedResistorCandidate> ChooseFixed(FrontEndDesign design, FixedResistorSearchOptions? options = null)
    {
        using var scope = Work.Scope(options?.Cancel ?? CancellationToken.None);
        return FixedResistorSearch.Run(design, options);
    }

    /// <summary>The firmware's code-to-temperature table with its error, fault thresholds and C header content.</summary>
    public static FirmwareTableRun Table(FrontEndDesign design, TableRequest? request = null) => FirmwareTableRun.Build(design, request ?? new TableRequest());

    /// <summary>A firmware table (CSV text of code and temperature) against the design, with the likely causes of disagreement.</summary>
    public static TableVerification VerifyTable(FrontEndDesign design, string csvText, string sourceName, FixedPointScale? unit = null,
        double? budgetKelvin = null, bool correctForLoading = false) =>
        TableVerifier.Verify(FirmwareFromDesign.Model(design, correctForLoading), TableCsvReader.Parse(csvText, sourceName, unit),
            budgetKelvin ?? design.Check.BudgetKelvin);

    /// <summary>A SPICE deck of the design for one analysis, for ngspice or any SPICE engine.</summary>
    public static string Deck(FrontEndDesign design, DeckAnalysis analysis, DeckOptions? options = null) =>
        FrontEndDecks.Write(design, analysis, options);
}

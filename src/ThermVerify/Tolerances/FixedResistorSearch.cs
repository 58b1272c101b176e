using ThermVerify.Check;
using ThermVerify.Components;
using ThermVerify.Design;
using ThermVerify.FrontEnd;
using ThermVerify.Limits;

namespace ThermVerify.Tolerances;

/// <summary>What makes one fixed resistor better than another.</summary>
public enum FixedResistorObjective
{
    /// <summary>The smallest worst reported error over the range (check, plus self-heating).</summary>
    WorstError,
    /// <summary>The finest worst resolution over the range, in K per LSB.</summary>
    WorstResolution,
    /// <summary>The steepest divider slope |dV/dT| at one temperature (closed form only).</summary>
    SlopeAt,
}

public sealed record FixedResistorSearchOptions
{
    public ESeries Series { get; init; } = ESeries.E96;
    public FixedResistorObjective Objective { get; init; } = FixedResistorObjective.WorstError;
    /// <summary>Candidates from here; null: the smallest sensor resistance over the range.</summary>
    public double? MinimumOhms { get; init; }
    /// <summary>Candidates up to here; null: the largest sensor resistance over the range.</summary>
    public double? MaximumOhms { get; init; }
    /// <summary>Temperature of <see cref="FixedResistorObjective.SlopeAt"/>; null: the middle of the check range.</summary>
    public double? SlopeCelsius { get; init; }
    public int Threads { get; init; } = Environment.ProcessorCount;
    /// <summary>Called from worker threads as candidates complete.</summary>
    public IProgress<RunProgress>? Progress { get; init; }
    public CancellationToken Cancel { get; init; }
}

/// <summary>
/// One candidate with its figures: the worst reported error (the check's error with the self-heating warming added,
/// at the worst temperature), the worst resolution, the slope at the objective's temperature and the largest
/// self-heating. Figures that the objective does not need are NaN when they were not simulated.
/// </summary>
public sealed record FixedResistorCandidate(
    double Ohms,
    double WorstErrorKelvin,
    double WorstErrorCelsius,
    double WorstKelvinPerLsb,
    double SlopeVoltsPerKelvin,
    double MaximumSelfHeatingKelvin,
    bool WithinBudget)
{
    /// <summary>The smallest room left under the budget over the range, budget − |error| (negative: over by that much); NaN for the slope objective.</summary>
    public double MarginKelvin { get; init; } = double.NaN;

    /// <summary>The design's own fixed resistor, ranked among the series values (and added to them when it is not one).</summary>
    public bool IsPresent { get; init; }

    /// <summary>A bridge's opposite low resistor re-balanced for this candidate (<see cref="BridgeHalfChoice"/>); null for every other design.</summary>
    public double? OppositeLowOhms { get; init; }
}

/// <summary>
/// Tries every value of an E-series (IEC 60063) between two bounds as the fixed resistor and ranks them. The error
/// and resolution objectives run the full check for each candidate (loading, leakage, settling by transient, with
/// the sampling transients on a coarser grid than `check`) and add the sensor's self-heating; the slope objective
/// is the closed form |dV/dT| = V·R_f/(R_s + R_f)²·|dR_s/dT|, whose maximum over R_f is at R_f = R_s (common practice).
/// </summary>
internal static class FixedResistorSearch
{
    /// <summary>Sampling transients per candidate: coarser than `check`, enough to follow a smooth settling error.</summary>
    private const int SamplingPointsPerCandidate = 9;

    public static IReadOnlyList<FixedResistorCandidate> Run(FrontEndDesign design, FixedResistorSearchOptions? options = null)
    {
        options ??= new FixedResistorSearchOptions();
        var (present, withFixed) = FixedOf(design);
        var sensor = design.Sensor.Build();
        var range = design.Check.Range;
        var ends = new[] { sensor.ResistanceOhms(range.MinCelsius), sensor.ResistanceOhms(range.MaxCelsius) };
        double low, high;
        if (design.CurrentSource is not null)
        {
            // FixedOf has refused a current source without a reference resistor.
            if (options.Objective == FixedResistorObjective.SlopeAt)
                throw new DesignException(design.Name, 1, 1, "current_source",
                    "the slope objective ranks a divider's fixed resistor; a current source's pin voltage I·R_s does not depend on the reference resistor",
                    "Rank by the worst error or the resolution (the reference resistor sets the LSB).");
            // From the smallest reference that still holds the amplified signal, G·R_s(max) (code = 2^N·G·R_s/R_ref), to 4 times it.
            low = options.MinimumOhms ?? design.Adc.ProgrammableGain * ends.Max();
            high = options.MaximumOhms ?? 4 * low;
        }
        else
        {
            // Between the sensor's extremes (a divider's or a netlist's fixed resistor): outside them the divider's slope
            // falls at both ends of the range at once.
            low = options.MinimumOhms ?? ends.Min();
            high = options.MaximumOhms ?? ends.Max();
        }
        if (!(low > 0 && high >= low))
            throw new ArgumentException($"The fixed-resistor search needs 0 < minimum ≤ maximum; got {low:G4} Ω to {high:G4} Ω.");
        var candidates = Candidates(options.Series, low, high);
        // The resistor fitted now is always ranked, so the gain of changing it can be judged.
        if (!candidates.Any(c => SameValue(c, present))) candidates = [.. candidates.Append(present).Order()];
        var slopeAt = options.SlopeCelsius ?? (range.MinCelsius + range.MaxCelsius) / 2;
        var results = new FixedResistorCandidate[candidates.Count];
        var parallel = new ParallelOptions { MaxDegreeOfParallelism = options.Threads, CancellationToken = options.Cancel };
        var done = 0;
        Parallel.For(0, candidates.Count, parallel, i =>
        {
            results[i] = Evaluate(withFixed(candidates[i]), candidates[i], options.Objective, slopeAt, options.Cancel)
                with { IsPresent = SameValue(candidates[i], present) };
            options.Progress?.Report(new RunProgress(Interlocked.Increment(ref done), candidates.Count));
        });
        return options.Objective switch
        {
            FixedResistorObjective.SlopeAt => [.. results.OrderByDescending(r => r.SlopeVoltsPerKelvin)],
            FixedResistorObjective.WorstResolution => [.. results.OrderBy(r => Key(r.WorstKelvinPerLsb))],
            _ => [.. results.OrderBy(r => Key(Math.Abs(r.WorstErrorKelvin))).ThenBy(r => r.WorstKelvinPerLsb)],
        };
    }

    /// <summary>Every series value in [low, high], ascending.</summary>
    public static IReadOnlyList<double> Candidates(ESeries series, double low, double high)
    {
        var list = new List<double>();
        var v = series.Contains(low) ? series.Nearest(low) : series.NextHigher(low);
        while (v <= high * (1 + 1e-12))
        {
            list.Add(v);
            v = series.NextHigher(v);
        }
        return list;
    }

    /// <summary>
    /// The design's present fixed resistor and the design with another value in its place: a divider's fixed resistor,
    /// a ratiometric current source's reference resistor, or the netlist resistor the design names as `fixed` in [netlist].
    /// </summary>
    public static (double PresentOhms, Func<double, FrontEndDesign> WithFixed) FixedOf(FrontEndDesign design)
    {
        if (design.Bridge is { } bridge) return BridgeHalfChoice.FixedOf(design, bridge);
        if (design.Netlist is { } netlist)
        {
            var name = netlist.FixedElement ?? throw new DesignException(design.Name, 1, 1, "netlist.fixed",
                "choose-fixed replaces a fixed resistor, and this netlist design names none",
                "Name the netlist's resistor to replace in [netlist]: fixed = \"Rtop\".");
            return (netlist.Parsed.Find(name)!.Value, ohms => design with { Netlist = netlist.WithValue(name, ohms) });
        }
        if (design.CurrentSource is { } source)
        {
            var reference = source.ReferenceResistorOhms ?? throw new DesignException(design.Name, 1, 1, "current_source",
                "choose-fixed chooses a divider's fixed resistor or a current source's reference resistor, and this design has neither: its converter has a fixed reference",
                "Run check, worstcase or montecarlo on it, or give current_source.reference_resistor (with adc.reference = \"ratiometric\").");
            return (reference, ohms => design with { CurrentSource = source with { ReferenceResistorOhms = ohms } });
        }
        var divider = design.VoltageDivider;
        return (divider.FixedResistorOhms, ohms => design with { Divider = divider with { FixedResistorOhms = ohms } });
    }

    /// <summary>The resistor the search chooses, as the design has it now.</summary>
    internal static double PresentOhms(FrontEndDesign design) => FixedOf(design).PresentOhms;

    /// <summary>What the search chooses, in words.</summary>
    internal static string PartName(FrontEndDesign design) =>
        design.Netlist?.FixedElement is { } name ? $"netlist resistor {name}"
        : design.Bridge is not null ? "bridge's sensor-half fixed resistor (the opposite low resistor re-balanced)"
        : design.CurrentSource is null ? "fixed resistor" : "reference resistor";

    private static FixedResistorCandidate Evaluate(FrontEndDesign candidate, double ohms, FixedResistorObjective objective, double slopeAt,
        CancellationToken cancel)
    {
        var model = new ClosedFormModel(candidate);
        var slope = Math.Abs(model.At(slopeAt).VoltsPerKelvin);
        if (objective == FixedResistorObjective.SlopeAt)
            return new FixedResistorCandidate(ohms, double.NaN, double.NaN, double.NaN, slope, double.NaN, false) { OppositeLowOhms = candidate.Bridge?.LowOhms };

        var check = FrontEndCheck.Run(candidate, new CheckOptions
        {
            MaximumSamplingPoints = SamplingPointsPerCandidate, Threads = 1, ComputeRemedies = false, RecordWaveform = false, Cancel = cancel,
        });
        var points = check.Points;
        // The check's error includes the sensor's self-heating (one error model); the rise is shown beside it.
        var rise = SelfHeating.RiseKelvin(candidate, SelfHeating.PowerWatts(candidate, model.Sensor,
            [.. points.Select(p => p.Celsius)], [.. points.Select(p => p.DividerVolts)]));
        var errors = points.Select(p => p.ErrorKelvin).ToArray();
        var worst = Enumerable.Range(0, errors.Length).MaxBy(i => Key(Math.Abs(errors[i])));
        // A current source must also hold its current and the amplified signal stay in range (a larger reference resistor
        // raises the source's output): a candidate that breaks either is over, whatever its errors.
        var within = Enumerable.Range(0, errors.Length).All(i => double.IsFinite(errors[i]) && Math.Abs(errors[i]) <= points[i].BudgetKelvin)
                     && !check.Findings.Any(f => f.Id is ComplianceRule.Id or GainRangeRule.Id or AmplifierRangeRule.CommonModeId or AmplifierRangeRule.OutputId)
                     && !DeltaSigmaChoice.Fails(check);
        var margin = Enumerable.Range(0, errors.Length).Min(i => double.IsFinite(errors[i]) ? points[i].BudgetKelvin - Math.Abs(errors[i]) : double.NegativeInfinity);
        return new FixedResistorCandidate(ohms, errors[worst], points[worst].Celsius,
            points.Max(p => p.KelvinPerLsb), slope, rise.DefaultIfEmpty(0).Max(), within) { MarginKelvin = margin, OppositeLowOhms = candidate.Bridge?.LowOhms };
    }

    private static bool SameValue(double a, double b) => Math.Abs(a / b - 1) < 1e-9;

    private static double Key(double v) => double.IsFinite(v) ? v : double.PositiveInfinity;
}

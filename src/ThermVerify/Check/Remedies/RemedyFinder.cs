using System.Globalization;
using ThermVerify.Design;
using ThermVerify.Limits;
using ThermVerify.Quantities;

namespace ThermVerify.Check.Remedies;

/// <summary>
/// Remedies proven on the whole design. For each finding, each design value that can shrink it (<see cref="Knobs"/>,
/// the dominant part first) is searched by bisection on the finding's own simulated quantity at its worst temperature
/// (<see cref="FindingProbe"/>); the value found, rounded to what the remedy prints, is put into a copy of the design
/// and the copy is checked in full. The remedy is given only when that check no longer has the finding and has no
/// failing finding the design did not already have. When the finding moves to another temperature the search is
/// repeated, held there and at every temperature searched before (at most three more times). When no single change
/// clears it, the parts of one effect are combined (what a calibration removes first, the rest searched), and the
/// changes whose check left a new failing finding are combined with a change for that finding; a combination is given
/// when its check clears it, otherwise the finding says so. The over-budget finding reuses the proofs (single or
/// combined) of the other findings where they also bring the total within budget, and searches the remaining changes
/// in the order of the contributions at its worst point. Checks of the same changes are made once.
/// </summary>
internal sealed class RemedyFinder
{
    private const int ExtraRounds = 3;
    private const int MaximumPairs = 8;

    private readonly CheckResult original;
    private readonly CheckOptions options;
    private readonly Dictionary<string, CheckResult?> checks = [];
    private readonly Dictionary<string, List<Attempt>> attempts = [];
    private readonly List<Combination> combinations = [];

    private RemedyFinder(CheckResult original, CheckOptions options)
    {
        this.original = original;
        // The checks a search makes are its own business: they report no progress of the check they serve.
        this.options = options with { ComputeRemedies = false, RecordWaveform = false, Progress = null, RemedyProgress = null };
    }

    private FrontEndDesign Design => original.Design;

    /// <summary>The result with every finding's proven remedies (and a note where no single change clears it).</summary>
    public static CheckResult Attach(CheckResult result, CheckOptions options)
    {
        var finder = new RemedyFinder(result, options);
        var done = new Dictionary<Finding, Finding>();
        // Progress counts the changes to search (each is at least one check of the changed design), not the findings:
        // one finding may have six changes and another none, so the count of findings says little of the time left.
        var plan = result.Findings.Where(f => f.Id != FindingRules.OverBudgetId).Concat(result.Findings.Where(f => f.Id == FindingRules.OverBudgetId))
            .Select(f =>
            {
                var worst = SearchPoint(result, f);
                return (Finding: f, Worst: worst, Knobs: finder.KnobsFor(f, worst));
            }).ToList();
        var total = plan.Sum(p => Math.Max(p.Knobs.Count, 1));
        var searched = 0;
        options.RemedyProgress?.Report(new RunProgress(0, total));
        foreach (var (finding, worst, knobs) in plan)
        {
            var before = searched;
            done[finding] = finder.Solve(finding, worst, knobs, () => options.RemedyProgress?.Report(new RunProgress(++searched, total)));
            searched = before + Math.Max(knobs.Count, 1);
            options.RemedyProgress?.Report(new RunProgress(searched, total));
        }
        return result with { Findings = [.. result.Findings.Select(f => done[f])] };
    }

    private IReadOnlyList<Knob> KnobsFor(Finding finding, CheckPoint worst) =>
        finding.Id == FindingRules.OverBudgetId ? OverBudgetKnobs(worst) : [.. Knobs.For(finding.Id, Design, worst), .. NetlistKnobs.For(finding.Id, Design, worst)];

    /// <summary>One change tried for a finding: the value and what the check of the changed design found.</summary>
    private sealed record Attempt(Knob Knob, double Value, CheckResult? Check);

    /// <summary>A combination proven for a finding: its changes (with how each was found) and the check of all of them applied.</summary>
    private sealed record Combination(string FindingId, IReadOnlyList<(Knob Knob, double Value, string Method)> Changes, CheckResult Check);

    /// <summary>The finding with its remedies; <paramref name="searched"/> is called after each of <paramref name="knobs"/>.</summary>
    private Finding Solve(Finding finding, CheckPoint worst, IReadOnlyList<Knob> knobs, Action searched)
    {
        if (knobs.Count == 0) return finding with { Remedies = [] };
        var tried = attempts[finding.Id] = [];
        var remedies = new List<Remedy>();
        foreach (var knob in knobs)
        {
            options.Cancel.ThrowIfCancellationRequested();
            if (Reused(finding, knob) is { } reused) remedies.Add(reused);
            else if (Single(finding, worst, knob, tried) is { } remedy) remedies.Add(remedy);
            searched();
        }
        if (remedies.Count > 0) return finding with { Remedies = remedies };
        if ((Pair(finding, tried) ?? ReusedCombination(finding)) is { } pair)
            return finding with { Remedies = [pair], RemedyNote = "no single change clears it; the smallest combination found, checked with every change of it applied:" };
        return finding with
        {
            Remedies = [],
            RemedyNote = "no single change of " + string.Join(", ", knobs.Select(k => k.Key).Distinct()) +
                         " within its searched range, nor a combination searched, clears it in a check of the changed design",
        };
    }

    /// <summary>For the over-budget finding: a change already proven for another finding whose check also has every point within budget.</summary>
    private Remedy? Reused(Finding finding, Knob knob)
    {
        if (finding.Id != FindingRules.OverBudgetId) return null;
        foreach (var (id, list) in attempts)
            foreach (var a in list.Where(a => a.Knob.Key == knob.Key && a.Check is { } c && Clears(c, finding.Id)))
                return Make(knob, a.Value, a.Check!, finding.Id,
                    I($"the change found for {id}; its check also has every point within the budget"));
        return null;
    }

    /// <summary>For the over-budget finding: a combination already proven for another finding whose check also has every point within budget.</summary>
    private Remedy? ReusedCombination(Finding finding)
    {
        if (finding.Id != FindingRules.OverBudgetId) return null;
        foreach (var c in combinations.Where(c => Clears(c.Check, finding.Id)).OrderBy(c => c.Changes.Count))
        {
            var (knob, value, _) = c.Changes[0];
            return Make(knob, value, c.Check, finding.Id, I($"the combination found for {c.FindingId}; its check also has every point within the budget")) with
            {
                Together = [.. c.Changes.Skip(1).Select(x => Make(x.Knob, x.Value, c.Check, finding.Id, x.Method))],
            };
        }
        return null;
    }

    private Remedy? Single(Finding finding, CheckPoint worst, Knob knob, List<Attempt> tried) =>
        Search(finding, finding, worst, knob, [], tried) is { } found
            ? Make(knob, found.Value, found.Check, finding.Id, Method(finding, found.At, knob, found.Round))
            : null;

    /// <summary>
    /// Searches <paramref name="knob"/> for <paramref name="target"/> on the design with <paramref name="fixedChanges"/>
    /// applied, and checks it with them; when the check still has the target at another temperature (or the rounding was
    /// not enough), searches again from the new value where it now is (at most <see cref="ExtraRounds"/> more times).
    /// Succeeds when the check clears <paramref name="addressed"/>.
    /// </summary>
    private (double Value, CheckResult Check, CheckPoint At, int Round)? Search(Finding addressed, Finding target, CheckPoint start, Knob knob,
        IReadOnlyList<(Knob Knob, double Value)> fixedChanges, List<Attempt>? tried)
    {
        var design = fixedChanges.Aggregate(Design, (d, c) => c.Knob.Apply(d, c.Value));
        // Every point searched so far stays in the search, the newest first: a finding that moves between
        // neighbouring temperatures (a code step, a quantisation phase) is then held at all of them at once.
        var points = new List<CheckPoint> { start };
        for (var round = 0; round <= ExtraRounds; round++)
        {
            if (Value(target, points, knob, design) is not { } found) return null;
            var value = Rounded(knob, found);
            var check = Check([.. fixedChanges, (knob, value)]);
            tried?.Add(new Attempt(knob, value, check));
            if (check is null) return null;
            if (Clears(check, addressed.Id)) return (value, check, points[0], round);
            // Still there (elsewhere, or the rounding was not enough): search again from the new value where it now is worst.
            if (check.Findings.FirstOrDefault(f => f.Id == target.Id) is not { } still || !FindingProbe.Supports(target.Id)) return null;
            design = knob.Apply(design, value);
            points.Insert(0, SearchPoint(check, still));
        }
        return null;
    }

    /// <summary>
    /// A second change for a change that cleared the finding but left a new failing one (a reservoir that kills the
    /// kick but cannot recover at this sample rate), or that fell short: the knobs of what its check still fails on.
    /// </summary>
    private Remedy? Pair(Finding finding, List<Attempt> tried)
    {
        var pairs = 0;
        // Parts of one effect (the converter's offset, gain and INL): the largest removed (calibrated out), then the
        // next searched; then the two largest removed and the next searched, and so on.
        var worst = SearchPoint(original, finding);
        // For the total, the parts of the effect that dominates at its worst point.
        var own = finding.Id != FindingRules.OverBudgetId ? Knobs.For(finding.Id, Design, worst)
            : FindingRules.ByContribution(worst.Contributions).FirstOrDefault() is { FindingId: var top } ? Knobs.For(top, Design, worst) : [];
        // What a calibration removes (an offset, a gain error) goes before what it leaves (drift; INL needs a
        // code-by-code correction); otherwise the dominant part first.
        var removable = own.Where(k => k.Better == Better.Lower && k.Limit(Design) == 0 && k.Current(Design) is > 0)
            .OrderBy(k => k.Calibrated ? 0 : 1).ToList();
        for (var n = 1; n < own.Count && n <= removable.Count; n++)
        {
            var removed = removable.Take(n).ToList();
            var fixedChanges = removed.Select(k => (k, 0.0)).ToList();
            if (pairs++ >= MaximumPairs) break;
            // Where the finding now is largest, with those parts gone (or whether their removal alone clears it).
            if (Check(fixedChanges) is not { } without) continue;
            var names = string.Join(" and ", removed.Select(k => k.Key));
            if (Clears(without, finding.Id))
                return Combined(finding.Id, [(removed[0], 0, I($"{names} removed")), .. removed.Skip(1).Select(k => (k, 0.0, "removed"))], without);
            if (without.Findings.FirstOrDefault(f => f.Id == finding.Id) is not { } still) continue;
            foreach (var b in own.Where(k => removed.All(r => r.Key != k.Key)))
            {
                if (pairs++ >= MaximumPairs) break;
                if (Search(finding, finding, SearchPoint(without, still), b, fixedChanges, null) is not { } found) continue;
                return Combined(finding.Id, [(removed[0], 0, I($"{names} removed, then {b.Key} searched")), .. removed.Skip(1).Select(k => (k, 0.0, "removed")),
                    (b, found.Value, Method(finding, found.At, b, found.Round))], found.Check);
            }
        }

        foreach (var a in tried.Where(a => a.Check is not null).DistinctBy(a => a.Knob.Key))
        {
            var changed = a.Knob.Apply(Design, a.Value);
            var failing = a.Check!.Findings.Where(f => f.Severity == Severity.Fail && (f.Id == finding.Id || !FailedBefore(f.Id))).ToList();
            foreach (var g in failing.Where(g => g.Id != FindingRules.OverBudgetId).Take(2))
            {
                var gWorst = SearchPoint(a.Check, g);
                foreach (var b in Knobs.For(g.Id, changed, gWorst).Where(k => k.Key != a.Knob.Key).Take(2))
                {
                    if (pairs++ >= MaximumPairs) return null;
                    if (Search(finding, g, gWorst, b, [(a.Knob, a.Value)], null) is not { } found) continue;
                    return Combined(finding.Id, [(a.Knob, a.Value, I($"for {finding.Id}, then {b.Key} for the {g.Id} it leaves")),
                        (b, found.Value, Method(g, found.At, b, found.Round))], found.Check);
                }
            }
        }
        return null;
    }

    /// <summary>A proven combination as one remedy (the first change, the others together with it), kept for the over-budget finding to reuse.</summary>
    private Remedy Combined(string findingId, IReadOnlyList<(Knob Knob, double Value, string Method)> changes, CheckResult check)
    {
        combinations.Add(new Combination(findingId, changes, check));
        var (knob, value, method) = changes[0];
        return Make(knob, value, check, findingId, method) with
        {
            Together = [.. changes.Skip(1).Select(c => Make(c.Knob, c.Value, check, findingId, c.Method))],
        };
    }

    /// <summary>
    /// The value a knob needs for a finding at its points: bisection on the finding's quantity, held within its target
    /// at every point; the resolution and the buffer's own searches otherwise.
    /// </summary>
    private double? Value(Finding finding, IReadOnlyList<CheckPoint> at, Knob knob, FrontEndDesign design)
    {
        if (finding.Id == "resolution" && knob == Knobs.Bits)
        {
            var extra = Math.Ceiling(Math.Log2(original.Points.Max(p => p.KelvinPerLsb / 2 / p.BudgetKelvin)));
            return extra > 0 ? design.Adc.Bits + extra : null;
        }
        if (FindingProbe.Supports(finding.Id))
        {
            // The reading the finding was worst at: its precharge case, and for sampled quantities its sample (the
            // converter's shift depends on the voltage it converts, which a failing settling moves far from the pin's).
            var perCase = finding.Id is "settling" or "reservoir-recovery" or "converter" or FindingRules.OverBudgetId or ChargeInjectionRule.Id;
            var perSample = finding.Id is "settling" or "converter" or FindingRules.OverBudgetId or ChargeInjectionRule.Id;
            var probes = at.Select(p => new FindingProbe(finding.Id, p.Celsius, perCase ? p.Precharge : null, perSample ? p.FirstConversion : null, options))
                .Select(p => (Probe: p, Target: p.Target(Design))).ToList();
            return KnobSearch.Find(knob, design, d => probes.All(p => p.Probe.Measure(d) <= p.Target));
        }
        // The buffer's loop, recovery and headroom have their own searches; their value is the one to prove.
        return finding.Remedies.FirstOrDefault(r => r.Key == knob.Key)?.Value;
    }

    /// <summary>
    /// The knobs of the columns, largest contribution at the worst point first, that could bring the total within the
    /// budget there on their own (removing the column entirely would): the others cannot clear it alone.
    /// </summary>
    private IReadOnlyList<Knob> OverBudgetKnobs(CheckPoint worst)
    {
        var knobs = new List<Knob>();
        var noise = worst.NoiseKelvin + worst.RampLagKelvin;
        // The noise (or the lag on the ramp) first where it breaks the budget that the static error leaves.
        if (worst.NoiseKelvin > 0 && double.IsFinite(worst.ErrorKelvin) && Math.Abs(worst.ErrorKelvin) + worst.RampLagKelvin <= worst.BudgetKelvin)
            knobs.AddRange(Knobs.For(Noise.NoiseFindingRules.NoiseId, Design, worst));
        if (worst.RampLagKelvin > 0 && double.IsFinite(worst.ErrorKelvin) && Math.Abs(worst.ErrorKelvin) + worst.NoiseKelvin <= worst.BudgetKelvin)
            knobs.AddRange(Knobs.For(Noise.NoiseFindingRules.RampLagId, Design, worst));
        foreach (var (_, id, kelvin) in FindingRules.ByContribution(worst.Contributions))
            if (kelvin != 0 && (!double.IsFinite(worst.ErrorKelvin) || Math.Abs(worst.ErrorKelvin - kelvin) + noise <= worst.BudgetKelvin))
                knobs.AddRange([.. Knobs.For(id, Design, worst), .. NetlistKnobs.For(id, Design, worst)]);
        return [.. knobs.DistinctBy(k => k.Key)];
    }

    private static double Rounded(Knob knob, double value) => knob.Round(value);

    /// <summary>The full check of the design with the changes applied (made once per set of changes); null when it cannot be simulated.</summary>
    private CheckResult? Check(IReadOnlyList<(Knob Knob, double Value)> changes)
    {
        var key = string.Join(";", changes.Select(c => c.Knob.Key + "=" + c.Value.ToString("R", CultureInfo.InvariantCulture)).Order());
        if (checks.TryGetValue(key, out var cached)) return cached;
        var design = changes.Aggregate(Design, (d, c) => c.Knob.Apply(d, c.Value));
        CheckResult? result;
        try
        {
            result = FrontEndCheck.Run(design, options);
        }
        catch (Exception e) when (e is Simulation.SimulationException or Circuits.CircuitException or ArgumentException)
        {
            result = null;
        }
        return checks[key] = result;
    }

    /// <summary>The proof: the finding is gone, and nothing fails that did not fail before.</summary>
    private bool Clears(CheckResult check, string findingId) =>
        check.Findings.All(f => f.Id != findingId) && check.Findings.Where(f => f.Severity == Severity.Fail).All(f => FailedBefore(f.Id));

    private bool FailedBefore(string id) => original.Findings.Any(f => f.Id == id && f.Severity == Severity.Fail);

    private Remedy Make(Knob knob, double value, CheckResult check, string findingId, string method)
    {
        var worst = check.Worst;
        var proof = I($"checked with the change: {findingId} gone, ") +
                    (check.Passed ? "PASS" : "FAIL") + I($", worst error {worst.ErrorKelvin:+0.000;-0.000} K at {worst.Celsius:0.##} °C");
        var current = knob.Current(Design) is { } c ? Format(c, knob) : "none";
        var action = value == 0 && knob.Removal is { } removal ? removal
            : knob == Knobs.Reservoir && Design.Filter.ReservoirCapacitorFarads > 0 ? "raise the reservoir capacitor (E12 value) to at least"
            : knob == Knobs.AddBuffer && Design.Buffer is not null ? "use an op-amp with gain-bandwidth of at least"
            : knob.Action;
        return new Remedy(knob.Key, action, value == 0 && knob.Removal is not null ? null : value, knob.Unit, I($"{method}; the design has {current}")) { Proof = proof };
    }

    private string Method(Finding finding, CheckPoint at, Knob knob, int round)
    {
        var what = finding.Id == FindingRules.OverBudgetId ? "the reported error against the budget" : I($"the simulated {finding.Id} against ½ LSB");
        var where = finding.Id is "settling" or "reservoir-recovery" ? I($"{at.Celsius:0.##} °C, precharge {at.Precharge.Name}") : I($"{at.Celsius:0.##} °C");
        var how = finding.Id == "resolution" ? "½ LSB in K against the budget at every point (IEEE Std 1241: ±Q/2)"
            : FindingProbe.Supports(finding.Id) ? I($"bisection on {what} at {where}")
            : "the value the buffer analysis computed";
        return how + (round > 0 ? I($" (searched again where the check of the first value still found it)") : "") +
               (Estimate(finding, at, knob) is { } e ? "; " + e : "");
    }

    /// <summary>The closed form beside a search, where one exists.</summary>
    private string? Estimate(Finding finding, CheckPoint at, Knob knob)
    {
        var adc = Design.Adc;
        var half = original.Adc.LsbVolts / 2;
        if (knob == Knobs.AcquisitionTime && Design.Filter.ReservoirCapacitorFarads == 0 && at.PrechargeVolts is { } pre)
        {
            var tau = EffectEstimator.SinglePoleTauSeconds(Design, at.Estimates.SourceOhms);
            var step = FrontEnd.SamplingFormulas.KickbackStepVolts(pre - at.StaticPinVolts, adc.SamplingCapacitanceFarads, adc.PinCapacitanceFarads);
            return I($"single-pole estimate τ·ln(|ΔV|/ε) = {Format(FrontEnd.SamplingFormulas.AcquisitionSecondsFor(step, half, tau), knob)}");
        }
        if (knob == Knobs.Reservoir && at.PrechargeVolts is { } p2)
            return I($"charge-sharing estimate C_sh·(|ΔV|/ε − 1) − C_pin = {Format(FrontEnd.SamplingFormulas.MinimumReservoirFarads(p2 - at.StaticPinVolts, half, adc.SamplingCapacitanceFarads) - adc.PinCapacitanceFarads, knob)}");
        if (knob == Knobs.SampleRate && at.PrechargeVolts is { } p3)
            return I($"switched-capacitor estimate R_eq = 1/(f_s·C_sh) (Johns & Martin): {Format(FrontEnd.SamplingFormulas.MaximumSampleRateHertz(p3 - at.IdealVolts, half, at.Estimates.SourceOhms, adc.SamplingCapacitanceFarads), knob)}");
        if (knob == Knobs.PinLeakage && at.Estimates.SourceOhms > 0)
            return I($"Ohm's law estimate ½ LSB / R_source = {Format(half / at.Estimates.SourceOhms / Math.Pow(2, ((Design.Check.BoardCelsius ?? at.Celsius) - adc.PinLeakageCelsius) / adc.LeakageDoublingKelvin), knob)} at {adc.PinLeakageCelsius:0.##} °C");
        return null;
    }

    private static string Format(double value, Knob knob) => knob.Unit switch
    {
        "s" => EngineeringFormat.Format(value, UnitKind.Second, 4),
        "F" => EngineeringFormat.Format(value, UnitKind.Farad, 4),
        "Hz" => EngineeringFormat.Format(value, UnitKind.Hertz, 4),
        "Ω" => EngineeringFormat.Format(value, UnitKind.Ohm, 4),
        "A" => EngineeringFormat.Format(value, UnitKind.Ampere, 4),
        "V" => EngineeringFormat.Format(value, UnitKind.Volt, 4),
        "V/K" => EngineeringFormat.Format(value, UnitKind.VoltPerKelvin, 4),
        "V/s" => EngineeringFormat.Format(value, UnitKind.VoltPerSecond, 4),
        "W/K" => EngineeringFormat.Format(value, UnitKind.WattPerKelvin, 4),
        "V/√Hz" => EngineeringFormat.Format(value, UnitKind.VoltPerRootHertz, 4),
        "ppm/K" => I($"{value * 1e6:0.###} ppm/K"),
        "conversions" => I($"{value:0} conversions"),
        "fraction" => I($"{value * 100:0.####} %"),
        _ => I($"{value:0.###} {knob.Unit}"),
    };

    /// <summary>
    /// Where a search for a finding is made: for an effect, the point where it is largest at the pin (the quantity held
    /// to ½ LSB everywhere); for the total and the buffer's own findings, the finding's worst point.
    /// </summary>
    private static CheckPoint SearchPoint(CheckResult result, Finding finding) =>
        FindingRules.ColumnVolts(finding.Id, result.Points[0]) is null
            ? PointNear(result, finding.WorstCelsius)
            : result.Points.MaxBy(p => Math.Abs(FindingRules.ColumnVolts(finding.Id, p)!.Value))!;

    private static CheckPoint PointNear(CheckResult result, double celsius) => result.Points.MinBy(p => Math.Abs(p.Celsius - celsius))!;

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}

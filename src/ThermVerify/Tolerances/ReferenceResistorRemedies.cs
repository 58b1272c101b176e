using System.Globalization;
using ThermVerify.Check;
using ThermVerify.Design;

namespace ThermVerify.Tolerances;

/// <summary>
/// The ratiometric reference resistor's tolerance or tempco a current-source design needs for its worst case to fit the
/// budget. The worst case is linear in each half-width: lowering the half-width a of one tolerance from a to a′ moves
/// the high corner down and the low corner up by |s|·(a − a′) at every temperature (s the sensitivity, K per unit), so
/// the largest a′ that brings every point within the room the noise leaves is
/// a′ = a − max_T(max(high − room, −room − low, 0)/|s|). The value, rounded down to three significant digits, is put
/// into a copy of the design and the whole worst case of the copy is run again (every corner verified in full): the
/// remedy is given only when that run is within budget, and searched again from the new sensitivities (at most
/// <see cref="Rounds"/> times) when the corners moved further than the linear estimate. When neither change alone
/// clears it, both are scaled down by one factor from the same closed form and proven the same way.
/// </summary>
internal static class ReferenceResistorRemedies
{
    private const int Rounds = 3;

    /// <summary>One of the reference resistor's tolerances: its kind, key, unit and how to set it in a copy of the design.</summary>
    private sealed record Part(ToleranceKind Kind, string Key, string Unit, string Action, Func<CurrentSourceSpec, double, CurrentSourceSpec> Set, Func<CurrentSourceSpec, double> Get);

    private static readonly Part[] Parts =
    [
        new(ToleranceKind.ReferenceResistance, "current_source.reference_resistor_tolerance", "fraction", "use a reference resistor with a tolerance of at most",
            (s, v) => s with { ReferenceResistorTolerance = v }, s => s.ReferenceResistorTolerance),
        new(ToleranceKind.ReferenceResistorTempco, "current_source.reference_resistor_tempco", "ppm/K", "use a reference resistor with a tempco of at most",
            (s, v) => s with { ReferenceResistorTempcoPerKelvin = (s.ReferenceResistorTempcoPerKelvin < 0 ? -1 : 1) * v }, s => Math.Abs(s.ReferenceResistorTempcoPerKelvin)),
    ];

    /// <summary>The result with the proven remedies (or a note that none of the reference resistor's changes clears it).</summary>
    public static WorstCaseResult Attach(FrontEndDesign design, WorstCaseResult result, WorstCaseOptions options)
    {
        if (result.WithinBudget || design.CurrentSource is not { ReferenceResistorOhms: not null }) return result;
        var worst = result.Points.ToList().IndexOf(result.Worst);
        var parts = Parts.Select(p => (Part: p, Sensitivity: result.Sensitivities.FirstOrDefault(s => s.Parameter.Kind == p.Kind)))
            .Where(x => x.Sensitivity is not null)
            .OrderByDescending(x => Math.Abs(x.Sensitivity!.KelvinPerUnit[worst] * x.Sensitivity.Parameter.HalfWidth))
            .Select(x => x.Part).ToList();
        if (parts.Count == 0) return result;
        var quiet = options with { Progress = null };
        var remedies = new List<Remedy>();
        foreach (var part in parts)
            if (Prove(design, result, [part], quiet) is { } found)
                remedies.Add(found);
        if (remedies.Count > 0) return result with { Remedies = remedies };
        if (parts.Count > 1 && Prove(design, result, parts, quiet) is { } both)
            return result with
            {
                Remedies = [both],
                RemedyNote = "no single change of the reference resistor clears it; its tolerance and tempco scaled down by one factor, checked with both applied:",
            };
        return result with
        {
            RemedyNote = "no tolerance or tempco of the reference resistor (" + string.Join(", ", parts.Select(p => p.Key)) +
                         "), alone or together, brings the worst case within budget: the other tolerances leave no room for it",
        };
    }

    /// <summary>
    /// The parts' half-widths scaled by the closed-form factor, rounded down, and the worst case of the changed design
    /// run in full; searched again from that run's sensitivities when it is not yet within budget.
    /// </summary>
    private static Remedy? Prove(FrontEndDesign design, WorstCaseResult original, IReadOnlyList<Part> parts, WorstCaseOptions options)
    {
        var source = design.CurrentSource!;
        var current = original;
        var values = parts.Select(p => p.Get(source)).ToArray();
        for (var round = 0; round <= Rounds; round++)
        {
            if (Factor(current, parts) is not { } factor) return null;
            var next = values.Select(v => RoundDown(v * factor)).ToArray();
            // No progress: the rounding cannot go lower than it is.
            if (round > 0 && next.SequenceEqual(values)) next = [.. values.Select(v => RoundDown(v * 0.99))];
            values = next;
            var changed = design with
            {
                CurrentSource = parts.Select((p, i) => (p, i)).Aggregate(source, (s, x) => x.p.Set(s, values[x.i])),
            };
            current = WorstCase.Run(changed, options);
            if (!current.WithinBudget) continue;
            return Make(design, original, current, parts, values, factor, round);
        }
        return null;
    }

    /// <summary>
    /// The largest factor f ∈ [0, 1) by which the parts' half-widths may be scaled for every point to come within the room
    /// its noise leaves, from the corners and sensitivities of <paramref name="r"/>; null when even f = 0 does not.
    /// </summary>
    private static double? Factor(WorstCaseResult r, IReadOnlyList<Part> parts)
    {
        var sensitivities = parts.Select(p => r.Sensitivities.FirstOrDefault(s => s.Parameter.Kind == p.Kind)).ToList();
        if (sensitivities.Any(s => s is null)) return null;
        var factor = 1.0;
        for (var k = 0; k < r.Points.Count; k++)
        {
            var p = r.Points[k];
            if (!double.IsFinite(p.HighKelvin) || !double.IsFinite(p.LowKelvin)) return null;
            var room = p.BudgetKelvin - p.NoiseKelvin;
            var excess = Math.Max(Math.Max(p.HighKelvin - room, -room - p.LowKelvin), 0);
            if (excess == 0) continue;
            var span = sensitivities.Sum(s => Math.Abs(s!.KelvinPerUnit[k] * s.Parameter.HalfWidth));
            if (span <= excess) return null;
            factor = Math.Min(factor, 1 - excess / span);
        }
        return factor < 1 ? factor : null;
    }

    private static Remedy Make(FrontEndDesign design, WorstCaseResult original, WorstCaseResult proven, IReadOnlyList<Part> parts, double[] values, double factor, int round)
    {
        var source = design.CurrentSource!;
        var w = proven.Worst;
        var proof = I($"worst case of the changed design run again, every corner verified in full: {(proven.WithinBudget ? "PASS" : "FAIL")}, ") +
                    I($"{w.LowKelvin:+0.000;-0.000} .. {w.HighKelvin:+0.000;-0.000} K at {w.Celsius:0.##} °C (budget ±{w.BudgetKelvin:0.###} K)");
        var o = original.Worst;
        Remedy One(Part p, int i)
        {
            var method = I($"the worst case is linear in each half-width a: a′ = a − max over T of (max(high − room, −room − low, 0)/|s|), ") +
                         I($"room = budget − noise; at {o.Celsius:0.##} °C the corners are {o.LowKelvin:+0.000;-0.000} .. {o.HighKelvin:+0.000;-0.000} K; ") +
                         I($"factor {factor:0.####} of the design's half-width, rounded down") +
                         (round > 0 ? I($" (searched again from the sensitivities of the changed design, {round} time(s))") : "") +
                         "; the design has " + Format(p.Get(source), p.Unit);
            return new Remedy(p.Key, p.Action, values[i], p.Unit, method) { Proof = proof };
        }
        return One(parts[0], 0) with { Together = [.. parts.Skip(1).Select((p, i) => One(p, i + 1))] };
    }

    private static string Format(double value, string unit) => unit == "ppm/K" ? I($"{value * 1e6:0.###} ppm/K") : I($"{value * 100:0.####} %");

    /// <summary>Three significant digits, rounded towards zero: the remedy asks for no more than it proves.</summary>
    private static double RoundDown(double value)
    {
        if (!(value > 0)) return 0;
        var scale = Math.Pow(10, Math.Floor(Math.Log10(value)) - 2);
        return Math.Floor(value / scale + 1e-9) * scale;
    }

    private static string I(FormattableString s) => s.ToString(CultureInfo.InvariantCulture);
}

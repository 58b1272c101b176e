using System.Text;
using static ThermVerify.Circuits.Spice.SpiceNumber;

namespace ThermVerify.Circuits.Spice;

/// <summary>What a deck says about itself: the title line and comments naming the design and each node.</summary>
internal sealed record SpiceDeckHeader(string Title)
{
    public IReadOnlyList<string> Notes { get; init; } = [];

    /// <summary>Node name → what the node is, written as comments.</summary>
    public IReadOnlyDictionary<string, string> NodeDescriptions { get; init; } = new Dictionary<string, string>();
}

/// <summary>
/// Any <see cref="Circuit"/> as a standard SPICE deck with one analysis. The deck states its temperatures
/// (<c>.options tnom=25</c> and <c>.temp</c>, because SPICE engines default to 27 °C), writes numbers in plain
/// exponent form and sets tolerances tight enough that a SPICE engine reproduces the built-in engine's results to
/// well within the cross-check limits. Vector names are the node names in lower case (SPICE ignores case).
/// </summary>
internal static class SpiceDeckWriter
{
    /// <summary>The deck's TNOM: the temperature resistor tempcos and sensor expressions are referred to.</summary>
    public const double NominalCelsius = 25;

    /// <param name="outputs">Output statements after the analysis; none writes a bare netlist and analysis.</param>
    public static string Write(Circuit circuit, SpiceAnalysis analysis, SpiceDeckHeader? header = null, IReadOnlyList<SpiceOutput>? outputs = null)
    {
        ArgumentNullException.ThrowIfNull(circuit);
        ArgumentNullException.ThrowIfNull(analysis);
        header ??= new SpiceDeckHeader("thermverify circuit");
        foreach (var node in circuit.NodeNames)
            if (!node.All(c => char.IsAsciiLetterOrDigit(c) || c is '_' or '#'))
                throw new EngineUnsupportedException($"Node name '{node}' is not a plain SPICE node name; use letters, digits and '_'.");

        var lines = new SpiceLines
        {
            StopTimeSeconds = analysis is TransientSweep t ? t.StopSeconds : null,
            TemperatureCelsius = circuit.TemperatureCelsius,
            WritesNoiseSources = analysis is NoiseSweep,
            SweepsTemperature = analysis is DcTemperatureSweep,
        };
        foreach (var element in circuit.Elements)
            element.WriteSpice(lines);

        var deck = new StringBuilder();
        // SPICE takes the first line as the title, whatever it holds.
        deck.AppendLine(OneLine(header.Title));
        deck.AppendLine("* Written by thermverify. Numbers are plain (1e-09, never 1n or 1M: SPICE reads M as milli).");
        foreach (var note in header.Notes)
            deck.AppendLine($"* {OneLine(note)}");
        foreach (var node in circuit.NodeNames)
            if (header.NodeDescriptions.TryGetValue(node, out var what))
                deck.AppendLine($"* node {node}: {OneLine(what)}");
        deck.AppendLine($".options tnom={Format(NominalCelsius)} numdgt=15 {Tolerances(analysis)}");
        deck.AppendLine($".temp {Format(circuit.TemperatureCelsius)}");
        deck.Append(lines.Netlist);
        if (analysis is TransientSweep { StepGuards.Count: > 0 } guarded)
            WriteGuards(deck, guarded.StepGuards);
        foreach (var definition in lines.Definitions)
            deck.AppendLine(definition);
        deck.AppendLine(AnalysisLine(analysis, circuit));
        foreach (var output in outputs ?? [])
            deck.AppendLine(output.Line());
        deck.AppendLine(".end");
        return deck.ToString();
    }

    /// <summary>Tight DC tolerances (a linear front end converges in two Newton steps anyway); transient ones from the analysis.</summary>
    private static string Tolerances(SpiceAnalysis analysis) => analysis switch
    {
        TransientSweep t => $"reltol={Format(t.RelativeTolerance)} vntol={Format(t.VoltageToleranceVolts)} abstol=1e-12 chgtol=1e-16 method=trap",
        // abstol below 1e-12 sends ngspice's operating point into gmin stepping even on a linear circuit.
        _ => "reltol=1e-9 vntol=1e-12 abstol=1e-12",
    };

    private static string AnalysisLine(SpiceAnalysis analysis, Circuit circuit) => analysis switch
    {
        OperatingPointAnalysis => ".op",
        DcSourceSweep d => $".dc {SourceName(circuit, d.Source)} {Format(d.Start)} {Format(d.Start + (d.Points - 0.5) * d.Step)} {Format(d.Step)}",
        DcTemperatureSweep d => $".dc temp {Format(d.StartCelsius)} {Format(d.StartCelsius + (d.Points - 0.5) * d.StepKelvin)} {Format(d.StepKelvin)}",
        TransientSweep t => $".tran {Format(t.MaxStepSeconds)} {Format(t.StopSeconds)} 0 {Format(t.MaxStepSeconds)}",
        AcSweep a => $".ac dec {a.PointsPerDecade} {Format(a.StartHertz)} {Format(a.StopHertz)}",
        NoiseSweep n => $".noise v({n.OutputNode}) {SourceName(circuit, n.InputSource)} dec {n.PointsPerDecade} {Format(n.StartHertz)} {Format(n.StopHertz)}",
        _ => throw new ArgumentException($"Unknown analysis {analysis.GetType().Name}."),
    };

    private static string SourceName(Circuit circuit, string name) => circuit[name] switch
    {
        VoltageSource => SpiceLines.InstanceName('V', name),
        CurrentSource => SpiceLines.InstanceName('I', name),
        var e => throw new EngineUnsupportedException($"{e.Describe} is not an independent source; a SPICE .dc sweep varies a V or I source."),
    };

    private static void WriteGuards(StringBuilder deck, IReadOnlyList<StepGuard> guards)
    {
        deck.AppendLine("* step guards: zero-valued sources whose corners force time points (no effect on the circuit)");
        deck.AppendLine("Rtv_guard tv_guard 0 1e9 noisy=0");
        for (var g = 0; g < guards.Count; g++)
        {
            var (start, window, period, points) = (guards[g].StartSeconds, guards[g].WindowSeconds, guards[g].PeriodSeconds, guards[g].Points);
            var d = window / points;
            // Each PULSE has four corners: delay, end of rise, end of width, end of fall.
            for (var j = 0; 4 * j + 4 <= points; j++)
                deck.AppendLine($"Itv_guard{g}_{j} tv_guard 0 PULSE(0 0 {Format(start + d * (4 * j + 1))} {Format(d)} {Format(d)} {Format(d)} {Format(period)})");
        }
    }

    private static string OneLine(string text) => text.Replace('\r', ' ').Replace('\n', ' ');
}

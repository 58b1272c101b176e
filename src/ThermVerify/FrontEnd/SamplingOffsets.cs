using ThermVerify.Design;

namespace ThermVerify.FrontEnd;

/// <summary>
/// How far the sample lies from the DC level it starts from, per precharge case, at every temperature of the check
/// grid: the first conversion from the settled (static) pin, with no sampling history (after a channel switch or
/// sleep; after switch-on when the design switches its divider), and the steady state from the pin with the average
/// sampling current. Sampling transients run on the grid points (<see cref="SettlingGrid"/>) and the offsets are
/// linear in temperature between them; <see cref="WithPoint"/> adds a transient at one more temperature (the worst).
/// </summary>
internal sealed record SamplingOffsets(
    IReadOnlyList<PrechargeCase> Cases,
    IReadOnlyList<int> SimulatedIndices,
    IReadOnlyList<SamplingOutcome> Outcomes,
    IReadOnlyList<double[]> FirstVolts,
    IReadOnlyList<double[]> SteadyVolts)
{
    public static SamplingOffsets Run(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperatures,
        int[] indices, DcLevels dc, double settleVolts, int threads, CancellationToken cancel, ICheckEngine engine, Action? runDone = null)
    {
        var outcomes = new List<SamplingOutcome>();
        var first = new double[cases.Count][];
        var steady = new double[cases.Count][];
        for (var c = 0; c < cases.Count; c++)
        {
            var pre = cases[c].Volts;
            var sampling = SettlingGrid.Run(design, pre, temperatures, indices, settleVolts, threads, cancel, engine, runDone);
            outcomes.AddRange(sampling);
            var firstAtGrid = FirstSamples(design, pre, temperatures, indices, sampling, settleVolts, threads, cancel, engine);
            first[c] = SettlingGrid.Interpolate(temperatures, indices, g => firstAtGrid[g] - dc.StaticSampleLevel(design, indices[g]));
            var cc = c;
            steady[c] = SettlingGrid.Interpolate(temperatures, indices, g => sampling[g].SteadyVolts - dc.AverageSampleLevel(design, cc, indices[g]));
        }
        return new SamplingOffsets(cases, indices, outcomes, first, steady);
    }

    /// <summary>
    /// The first conversion alone at each point (one conversion per run, no steady state), the steady offsets left at
    /// zero: for a remedy search on a first-conversion reading.
    /// </summary>
    public static SamplingOffsets FirstOnly(FrontEndDesign design, IReadOnlyList<PrechargeCase> cases, IReadOnlyList<double> temperatures,
        DcLevels dc, double settleVolts, ICheckEngine engine)
    {
        var first = cases.Select(c => temperatures.Select((t, i) =>
            (!SwitchOnSettling.Applies(design)
                ? SamplingRun.FirstSampleVolts(design, t, c.Volts, settleVolts, engine)
                : SwitchOnSettling.FirstSampleVolts(design, t, c.Volts, settleVolts, engine)) - dc.StaticSampleLevel(design, i)).ToArray()).ToArray();
        return new(cases, [.. Enumerable.Range(0, temperatures.Count)], [], first, [.. cases.Select(_ => new double[temperatures.Count])]);
    }

    /// <summary>No sampling transients: every offset zero (for questions about DC effects alone).</summary>
    public static SamplingOffsets None(IReadOnlyList<PrechargeCase> cases, int points) =>
        new(cases, [], [], [.. cases.Select(_ => new double[points])], [.. cases.Select(_ => new double[points])]);

    /// <summary>
    /// The offsets with a sampling transient at point <paramref name="index"/> for the reading that is worst there: its
    /// precharge case <paramref name="precharge"/>, and the first conversion alone (one conversion) when that reading is
    /// a first conversion, else the run to the steady state. No change when the point was simulated already, unless
    /// <paramref name="rerun"/> (another unit's parts in <paramref name="design"/>).
    /// </summary>
    public SamplingOffsets WithPoint(FrontEndDesign design, IReadOnlyList<double> temperatures, int index, DcLevels dc, double settleVolts,
        CancellationToken cancel, ICheckEngine engine, int precharge, bool firstOnly, bool rerun = false)
    {
        if (!rerun && SimulatedIndices.Contains(index)) return this;
        var outcomes = Outcomes.ToList();
        var first = FirstVolts.Select(a => (double[])a.Clone()).ToArray();
        var steady = SteadyVolts.Select(a => (double[])a.Clone()).ToArray();
        var pre = Cases[precharge].Volts;
        var t = temperatures[index];
        double firstSample;
        if (firstOnly)
            firstSample = !SwitchOnSettling.Applies(design)
                ? SamplingRun.FirstSampleVolts(design, t, pre, settleVolts, engine)
                : SwitchOnSettling.FirstSampleVolts(design, t, pre, settleVolts, engine);
        else
        {
            var run = SamplingRun.Run(design, t, pre, settleVolts, cancel: cancel, engine: engine);
            outcomes.Add(run);
            firstSample = !SwitchOnSettling.Applies(design) ? run.FirstVolts : SwitchOnSettling.FirstSampleVolts(design, t, pre, settleVolts, engine);
            steady[precharge][index] = run.SteadyVolts - dc.AverageSampleLevel(design, precharge, index);
        }
        first[precharge][index] = firstSample - dc.StaticSampleLevel(design, index);
        return this with { SimulatedIndices = [.. SimulatedIndices.Append(index).Distinct()], Outcomes = outcomes, FirstVolts = first, SteadyVolts = steady };
    }

    /// <summary>The first sample at each grid point: the first conversion of the sampling run, or after switch-on for a switched divider.</summary>
    private static double[] FirstSamples(FrontEndDesign design, double? pre, IReadOnlyList<double> temperatures, int[] indices,
        SamplingOutcome[] sampling, double settleVolts, int threads, CancellationToken cancel, ICheckEngine engine)
    {
        if (!SwitchOnSettling.Applies(design)) return [.. sampling.Select(s => s.FirstVolts)];
        var switchOn = new double[indices.Length];
        Parallel.For(0, indices.Length, new ParallelOptions { MaxDegreeOfParallelism = threads, CancellationToken = cancel },
            g => switchOn[g] = SwitchOnSettling.FirstSampleVolts(design, temperatures[indices[g]], pre, settleVolts, engine));
        return switchOn;
    }
}

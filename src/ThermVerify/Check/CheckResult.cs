using ThermVerify.Check.Buffer;
using ThermVerify.Design;
using ThermVerify.Firmware;
using ThermVerify.FrontEnd;
using ThermVerify.Limits;

namespace ThermVerify.Check;

/// <summary>How a check is run; the defaults suit a CI run on a small machine.</summary>
public sealed record CheckOptions
{
    /// <summary>At most this many temperatures get a sampling transient (every point when the sweep has fewer).</summary>
    public int MaximumSamplingPoints { get; init; } = 25;

    public int Threads { get; init; } = Environment.ProcessorCount;

    /// <summary>
    /// Search for remedies when a finding needs one: bisection on the simulated finding at its worst temperature,
    /// then a check of the design with the change applied, which must clear the finding (the proof).
    /// </summary>
    public bool ComputeRemedies { get; init; } = true;

    /// <summary>
    /// Record the sampling waveform at the worst point for the report's figure (<see cref="CheckResult.Waveform"/>).
    /// Remedy proofs and search candidates, whose results no report draws, turn it off: on an op-amp buffer near its
    /// rail the 483 reads of the recording cost more than the rest of the check.
    /// </summary>
    public bool RecordWaveform { get; init; } = true;

    public CancellationToken Cancel { get; init; }

    /// <summary>The engine that runs the temperature sweeps and sampling transients (remedy searches included).</summary>
    public ICheckEngine Engine { get; init; } = BuiltInEngine.Instance;

    /// <summary>Told of every sampling transient of the check grid as it completes (from worker threads): the long part of a check, through ngspice above all.</summary>
    public IProgress<RunProgress>? Progress { get; init; }

    /// <summary>Told of every finding whose remedy search has ended (each search checks the design again, several times).</summary>
    public IProgress<RunProgress>? RemedyProgress { get; init; }
}

/// <summary>
/// Everything `check` found: every point of the sweep, the sampling runs, the findings and the verdict, and the
/// sampling waveform at the worst point (recorded by the check's own engine, so reports draw it without simulating;
/// without conversions when <see cref="CheckOptions.RecordWaveform"/> is off or the converter is a delta-sigma one).
/// </summary>
public sealed record CheckResult(
    FrontEndDesign Design,
    string SensorDescription,
    AdcTransfer Adc,
    IReadOnlyList<CheckPoint> Points,
    IReadOnlyList<SamplingOutcome> Sampling,
    IReadOnlyList<Finding> Findings,
    SamplingWaveform Waveform)
{
    /// <summary>The op-amp buffer's own sections (stability, headroom, static errors, recovery, noise) when the design has one.</summary>
    public Buffer.BufferReport? Buffer { get; init; }

    /// <summary>The codes a broken sensor or fixed resistor produce and the thresholds that catch them; null when the tolerances leave no room.</summary>
    public FaultThresholds? Faults { get; init; }

    /// <summary>Why <see cref="Faults"/> is null, for the report: a check never leaves a section out without saying so.</summary>
    public string? FaultsOmitted { get; init; }

    /// <summary>The reading's noise over the range (five temperatures): what the budget counts at each point, for the reports.</summary>
    public Noise.NoiseSummary? Noise { get; init; }

    /// <summary>A delta-sigma converter's own analyses (filter, input load, channel switch, rejection); null for a successive-approximation converter.</summary>
    public DeltaSigma.DeltaSigmaReport? DeltaSigma { get; init; }

    /// <summary>The precharge cases the check covered (the design's setting; "worst" covers the last sample, 0 V and full scale).</summary>
    public IReadOnlyList<PrechargeCase> PrechargeCases { get; init; } = [PrechargeCase.LastSample];

    public bool Passed => Points.All(p => p.WithinBudget) && Findings.All(f => f.Severity != Severity.Fail);

    /// <summary>The point with the largest reported error (an unreadable code counts as the largest).</summary>
    public CheckPoint Worst => Points.MaxBy(p => double.IsFinite(p.ErrorKelvin) ? Math.Abs(p.ErrorKelvin) : double.PositiveInfinity)!;
}

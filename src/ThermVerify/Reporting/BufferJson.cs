using ThermVerify.Check.Buffer;

namespace ThermVerify.Reporting;

/// <summary>The "buffer" object of the check JSON (docs/json-output.md): SI units, null where a value does not exist.</summary>
internal static class BufferJson
{
    public static object? Document(BufferReport? b) => b is null ? null : new
    {
        stability = new
        {
            method = b.Stability.Method,
            minimumPhaseMarginDegrees = b.Stability.MinimumPhaseMarginDegrees,
            passed = b.Stability.Passed,
            targetPhaseMarginDegrees = b.Stability.TargetPhaseMarginDegrees,
            isolationForTargetOhms = N(b.Stability.IsolationForTargetOhms),
            closedFormIsolationForTargetOhms = N(b.Stability.ClosedFormIsolationForTargetOhms),
            loops = b.Stability.Loops.Select(l => new
            {
                celsius = l.Celsius,
                crossoverHertz = N(l.CrossoverHertz),
                phaseMarginDegrees = N(l.PhaseMarginDegrees),
                closedFormPhaseMarginDegrees = N(l.ClosedFormPhaseMarginDegrees),
                phaseCrossoverHertz = N(l.PhaseCrossoverHertz),
                gainMarginDecibels = N(l.GainMarginDecibels),
            }),
            step = b.Stability.Step is { } s ? new
            {
                node = s.Node,
                stepVolts = s.StepVolts,
                overshootPercent = s.OvershootPercent,
                peakSeconds = s.PeakSeconds,
                settlingSeconds = N(s.SettlingSeconds),
            } : null,
        },
        headroom = new
        {
            inputLowVolts = N(b.Headroom.InputLowVolts),
            inputHighVolts = N(b.Headroom.InputHighVolts),
            outputLowVolts = N(b.Headroom.OutputLowVolts),
            outputHighVolts = N(b.Headroom.OutputHighVolts),
            minimumMarginVolts = N(b.Headroom.MinimumMarginVolts),
            violations = b.Headroom.Violations.Select(v => new
            {
                limit = v.Limit,
                side = v.Side,
                limitVolts = v.LimitVolts,
                fromCelsius = v.FromCelsius,
                toCelsius = v.ToCelsius,
                worstCelsius = v.WorstCelsius,
                worstVolts = v.WorstVolts,
                clippedCode = v.ClippedCode,
            }),
        },
        staticErrors = b.StaticErrors.Select(p => new
        {
            celsius = p.Celsius,
            offsetVolts = p.OffsetVolts,
            driftVolts = p.DriftVolts,
            biasVolts = p.BiasVolts,
            sourceOhms = p.SourceOhms,
            totalVolts = p.TotalVolts,
            totalLsb = p.TotalLsb,
            totalKelvin = N(p.TotalKelvin),
        }),
        recovery = b.Recovery is { } r ? new
        {
            celsius = r.Celsius,
            prechargeVolts = r.PrechargeVolts,
            settlingErrorVolts = r.SettlingErrorVolts,
            idealBufferSettlingErrorVolts = r.IdealBufferSettlingErrorVolts,
            bufferShareVolts = r.BufferShareVolts,
            noSlewLimitSettlingErrorVolts = r.NoSlewLimitSettlingErrorVolts,
            slewShareVolts = r.SlewShareVolts,
            bandwidthShareVolts = r.BandwidthShareVolts,
            allowedVolts = r.AllowedVolts,
            neededGainBandwidthHertz = N(r.NeededGainBandwidthHertz),
            neededSlewRateVoltsPerSecond = N(r.NeededSlewRateVoltsPerSecond),
            method = r.Method,
        } : null,
        noise = new
        {
            method = b.Noise.Method,
            fromHertz = b.Noise.FromHertz,
            toHertz = b.Noise.ToHertz,
            filterTimeConstantSeconds = b.Noise.FilterTimeConstantSeconds,
            sampleCorrelation = b.Noise.SampleCorrelation,
            points = b.Noise.Points.Select(p => new
            {
                celsius = p.Celsius,
                rmsVolts = p.RmsVolts,
                rmsLsb = p.RmsLsb,
                rmsKelvin = N(p.RmsKelvin),
                samplingRmsVolts = p.SamplingRmsVolts,
                ktcVolts = p.KtcVolts,
                frontEndRmsVolts = p.FrontEndRmsVolts,
                contributions = p.Contributions.Select(c => new { element = c.Element, label = c.Label, rmsVolts = c.RmsVolts }),
            }),
            averaging = b.Noise.Averaging.Select(a => new
            {
                conversions = a.Conversions,
                whiteRmsVolts = a.WhiteRmsVolts,
                correlatedRmsVolts = a.CorrelatedRmsVolts,
                correlatedRmsKelvin = N(a.CorrelatedRmsKelvin),
            }),
        },
    };

    private static double? N(double? value) => value is { } v && double.IsFinite(v) ? v : null;
}

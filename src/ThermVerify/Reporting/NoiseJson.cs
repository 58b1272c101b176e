using ThermVerify.Check.Noise;

namespace ThermVerify.Reporting;

/// <summary>The "noise" object of the check's JSON (docs/json-output.md): SI units, null where a figure does not exist.</summary>
internal static class NoiseJson
{
    public static object? ToJson(NoiseSummary? n) => n is null ? null : new
    {
        method = n.Method,
        fromHertz = n.FromHertz,
        toHertz = n.ToHertz,
        noiseBandwidthHertz = double.IsFinite(n.NoiseBandwidthHertz) ? n.NoiseBandwidthHertz : (double?)null,
        converterNoise = n.ConverterNoise,
        converterNoiseAssumed = n.ConverterNoiseAssumed,
        readingsAveraged = n.ReadingsAveraged,
        readingSeconds = n.ReadingSeconds,
        correlationSeconds = n.CorrelationSeconds,
        effectiveReadings = n.EffectiveReadings,
        rampKelvinPerSecond = n.RampKelvinPerSecond,
        lagSeconds = n.LagSeconds,
        points = n.Points.Select(p => new
        {
            celsius = p.Celsius,
            frontEndRmsVolts = p.AnalogRmsVolts,
            kTCRmsVolts = p.KtcRmsVolts,
            fastRmsVolts = p.FastRmsVolts,
            slowRmsVolts = p.SlowRmsVolts,
            converterRmsVolts = p.ConverterRmsVolts,
            conversionRmsVolts = p.SingleRmsVolts,
            readingRmsVolts = p.AveragedRmsVolts,
            readingRmsKelvin = p.AveragedRmsKelvin,
            coverage = p.Coverage,
            coveredKelvin = p.CoveredKelvin,
            lsbKelvin = p.LsbKelvin,
            noiseFreeResolutionKelvin = p.NoiseFreeResolutionKelvin,
            correlation = p.Correlation,
            rampLagKelvin = p.RampLagKelvin,
            shares = p.Shares.Select(s => new { source = s.Source, label = s.Label, rmsVolts = s.RmsVolts }),
            pinDensity = p.PinDensity.Select(d => new { hertz = d.Hertz, voltsPerRootHertz = d.VoltsPerRootHertz }),
        }),
    };
}

using System.Text.Json;
using ThermVerify.Reporting.Text;
using ThermVerify.Check;
using ThermVerify.Firmware;
using ThermVerify.Provenance;

namespace ThermVerify.Reporting;

/// <summary>
/// The check result as JSON, schema "thermverify.check/1" (docs/json-output.md). Field names never change within a
/// schema version; numbers are SI (V, Ω, K, °C, s, Hz); values that do not exist (a code no sensor can produce)
/// are null, never NaN.
/// </summary>
public static class CheckJson
{
    public const string Schema = "thermverify.check/2";

    public static string Write(CheckResult result, RunProvenance provenance, string? designPath = null) =>
        JsonSerializer.Serialize(ToDocument(result, provenance, designPath, result.Faults), ReportJson.Options);

    private static object ToDocument(CheckResult r, RunProvenance provenance, string? designPath, FaultThresholds? faults) => new
    {
        schema = Schema,
        tool = ReportJson.Tool(provenance),
        provenance = ProvenanceJson.ToJson(provenance),
        design = new { name = r.Design.Name, file = designPath, sensor = r.SensorDescription },
        verdict = new
        {
            passed = r.Passed,
            worstCelsius = r.Worst.Celsius,
            worstErrorKelvin = N(r.Worst.ErrorKelvin),
            worstBudgetKelvin = r.Worst.BudgetKelvin,
            pointsOverBudget = r.Points.Count(p => !p.WithinBudget),
            points = r.Points.Count,
            failFindings = r.Findings.Count(f => f.Severity == Severity.Fail),
        },
        conventions = new
        {
            adcTransfer = r.Adc.Describe(),
            firstTransitionLsb = r.Adc.FirstTransitionLsb,
            firmwareInverse = r.Adc.Inverse == Design.CodeInverse.BinMiddle ? "bin-middle" : "bin-edge",
            error = "reported minus true temperature, in K",
            sample = "the worst reading over the precharge cases, the first conversion (from the settled pin) and the steady state, and the INL sign",
            contributions = "walked from the closed form to the code one cause at a time, each step through the exact inverse; they add up to the error",
        },
        // The tolerances of nominal-valued parts: this verdict is of the unit with each at nominal (worstcase and montecarlo spread them).
        nominalParts = Tolerances.NominalValuedTolerances.Of(r.Design).Select(p => new { key = p.Key, halfWidth = p.HalfWidth, unit = p.Unit }),
        precharge = new
        {
            mode = ReportFormat.PrechargeText(r.Design.Adc.Precharge),
            cases = r.PrechargeCases.Select(c => new { name = c.Name, volts = c.Volts }),
        },
        adc = new
        {
            bits = r.Adc.Bits, referenceVolts = r.Adc.ReferenceVolts, lsbVolts = r.Adc.LsbVolts,
            gainStage = r.Design.Adc.GainStage is { } g
                ? new
                {
                    gain = g.Gain, gainError = g.GainError, gainErrorBound = !g.GainErrorSigned,
                    inputCurrentAmperes = g.InputCurrentAmperes, inputCurrentBound = !g.InputCurrentSigned,
                    converterReferenceVolts = r.Design.NominalReferenceVolts,
                }
                : null,
        },
        noise = NoiseJson.ToJson(r.Noise),
        deltaSigma = DeltaSigmaJson.ToJson(r.DeltaSigma),
        points = r.Points.Select(p => new
        {
            celsius = p.Celsius,
            sensorOhms = p.SensorOhms,
            idealVolts = p.IdealVolts,
            dividerVolts = p.DividerVolts,
            staticPinVolts = p.StaticPinVolts,
            dcPinVolts = p.DcPinVolts,
            firstSampleVolts = p.FirstSampleVolts,
            steadySampleVolts = p.SteadySampleVolts,
            sampleVolts = p.SampleVolts,
            precharge = p.Precharge.Name,
            prechargeVolts = p.PrechargeVolts,
            sample = p.SampleKind,
            corner = p.Corner.Length > 0 ? p.Corner : null,
            samplingSimulated = p.SamplingSimulated,
            code = p.Code,
            reportedCelsius = N(p.ReportedCelsius),
            errorKelvin = N(p.ErrorKelvin),
            budgetKelvin = p.BudgetKelvin,
            withinBudget = p.WithinBudget,
            kelvinPerLsb = p.KelvinPerLsb,
            noiseKelvin = p.NoiseKelvin,
            rampLagKelvin = p.RampLagKelvin,
            noiseFreeResolutionKelvin = p.Noise?.NoiseFreeResolutionKelvin,
            contributionsKelvin = new
            {
                quantisation = N(p.Contributions.QuantisationKelvin),
                converter = N(p.Contributions.ConverterKelvin),
                dcLoading = N(p.Contributions.DcLoadingKelvin),
                recovery = N(p.Contributions.RecoveryKelvin),
                settling = N(p.Contributions.SettlingKelvin),
                buffer = N(p.Contributions.BufferKelvin),
                selfHeating = N(p.Contributions.SelfHeatingKelvin),
                rest = N(p.Contributions.RestKelvin),
            },
            simulatedVolts = new
            {
                buffer = p.Simulated.BufferVolts,
                dcLoading = p.Simulated.DcLoadingVolts,
                recovery = p.Simulated.RecoveryVolts,
                settling = p.Simulated.SettlingVolts,
                selfHeating = p.Simulated.SelfHeatingVolts,
                converter = p.Simulated.ConverterVolts,
                firstSettling = p.Simulated.FirstSettlingVolts,
                steadySettling = p.Simulated.SteadySettlingVolts,
                averageSampling = p.Simulated.AverageSamplingVolts,
            },
            estimatedVolts = new
            {
                sourceOhms = p.Estimates.SourceOhms,
                fixedDrift = p.Estimates.FixedDriftVolts,
                leakage = p.Estimates.LeakageVolts,
                excitation = p.Estimates.ExcitationVolts,
                bufferOffset = p.Estimates.BufferOffsetVolts,
                biasCurrent = p.Estimates.BiasCurrentVolts,
                averageSampling = p.Estimates.AverageSamplingVolts,
                firstConversion = p.Estimates.FirstConversionVolts,
                steadySettling = p.Estimates.SteadySettlingVolts,
                selfHeating = p.Estimates.SelfHeatingVolts,
            },
        }),
        sampling = r.Sampling.Select(s => new
        {
            celsius = s.Celsius,
            prechargeVolts = s.PrechargeVolts,
            firstVolts = s.FirstVolts,
            steadyVolts = s.SteadyVolts,
            conversions = s.ConversionsSimulated,
            extrapolated = s.Extrapolated,
            exactSteadyState = s.ExactSteadyState,
        }),
        buffer = BufferJson.Document(r.Buffer),
        faultThresholds = faults is null ? null : new
        {
            faultBelowCode = faults.FaultBelowCode,
            faultAboveCode = faults.FaultAboveCode,
            lowestValidCode = faults.LowestValidCode,
            highestValidCode = faults.HighestValidCode,
            faults = faults.Faults.Select(f => new { kind = FaultText.Kind(f.Kind), minCode = f.MinCode, maxCode = f.MaxCode }),
        },
        findings = r.Findings.Select(f => new
        {
            id = f.Id,
            severity = f.Severity.ToString().ToLowerInvariant(),
            title = f.Title,
            fromCelsius = f.FromCelsius,
            toCelsius = f.ToCelsius,
            worstCelsius = f.WorstCelsius,
            sizeVolts = N(f.SizeVolts),
            sizeLsb = N(f.SizeLsb),
            sizeKelvin = N(f.SizeKelvin),
            cause = f.Cause,
            estimateVolts = N(f.EstimateVolts),
            simulatedVolts = N(f.SimulatedVolts),
            remedyNote = f.RemedyNote,
            remedies = f.Remedies.Select(m => new
            {
                key = m.Key, action = m.Action, value = N(m.Value), unit = m.Unit, method = m.Method, proof = m.Proof,
                together = m.Together.Select(t => new { key = t.Key, action = t.Action, value = N(t.Value), unit = t.Unit, method = t.Method }),
            }),
        }),
    };

    private static double? N(double? value) => ReportJson.N(value);

}

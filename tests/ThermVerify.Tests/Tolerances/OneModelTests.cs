using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Tests.Ngspice;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Tolerances;

/// <summary>
/// check and the tolerance analyses share one error model: the Monte Carlo unit with every deviation zero is the
/// design with each bound spread about zero (converter offset, gain and INL, op-amp offset, drift and bias, fixed and
/// reference tempcos) at zero, and `check` of that design reports exactly the same error at every temperature, bit for
/// bit. A difference of any size here means the two analyses model something differently.
/// </summary>
public class OneModelTests
{
    /// <summary>
    /// The nominal unit written out by hand from the design: every bound the tolerance analyses spread about zero (a
    /// value written without a sign) at zero; values written with a sign stay.
    /// </summary>
    private static FrontEndDesign NominalUnit(FrontEndDesign d) => d with
    {
        Divider = d.VoltageDivider with { FixedTempcoPerKelvin = d.VoltageDivider.FixedTempcoSigned ? d.VoltageDivider.FixedTempcoPerKelvin : 0 },
        Adc = d.Adc with
        {
            OffsetErrorLsb = d.Adc.OffsetErrorSigned ? d.Adc.OffsetErrorLsb : 0,
            GainError = d.Adc.GainErrorSigned ? d.Adc.GainError : 0,
            InlLsb = 0,
            ReferenceTempcoPerKelvin = d.Adc.ReferenceTempcoSigned ? d.Adc.ReferenceTempcoPerKelvin : 0,
        },
        Buffer = d.Buffer is { } b
            ? b with
            {
                OffsetVolts = b.OffsetSigned ? b.OffsetVolts : 0,
                OffsetDriftVoltsPerKelvin = b.OffsetDriftSigned ? b.OffsetDriftVoltsPerKelvin : 0,
                BiasCurrentAmperes = b.BiasCurrentSigned ? b.BiasCurrentAmperes : 0,
            }
            : null,
    };

    [Theory]
    [InlineData("cold-storage-logger-buffered.toml", "half-lsb")]
    [InlineData("oven-pt1000.toml", "one-lsb")]
    [InlineData("soil-probe-switched.toml", "half-lsb")]
    [InlineData("cold-storage-logger-reservoir.toml", "one-lsb")]
    public void The_check_of_the_nominal_unit_equals_the_monte_carlo_unit_with_zero_deviations(string example, string transition)
    {
        var loaded = ExampleDesigns.Load(example);
        // A coarser grid than the example's keeps the test short; both analyses use the same one.
        var range = loaded.Check.Range;
        var design = loaded with
        {
            Check = loaded.Check with { StepKelvin = (range.MaxCelsius - range.MinCelsius) / 6 },
            Adc = loaded.Adc with { FirstTransition = transition == "one-lsb" ? FirstTransition.OneLsb : FirstTransition.HalfLsb },
        };
        const int samplingPoints = 3;
        var evaluator = new UnitEvaluator(design, threads: 2, maximumSamplingPoints: samplingPoints);
        var unit = evaluator.Evaluate(new double[evaluator.Set.Count]);
        var check = FrontEndCheck.Run(NominalUnit(design), new CheckOptions { ComputeRemedies = false, MaximumSamplingPoints = samplingPoints, Threads = 2 });

        Assert.Equal(check.Points.Count, unit.ErrorKelvin.Length);
        for (var i = 0; i < unit.ErrorKelvin.Length; i++)
            Assert.True(check.Points[i].ErrorKelvin.Equals(unit.ErrorKelvin[i]),
                $"{example} at {check.Points[i].Celsius} °C: check {check.Points[i].ErrorKelvin:R} K, unit {unit.ErrorKelvin[i]:R} K");
        Assert.Equal(check.Worst.Celsius, evaluator.Temperatures[unit.WorstIndex]);
    }
}

using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Making a declared error larger never makes the check more optimistic: over every bundled example and every error
/// it declares (converter offset, gain error and INL, the op-amp's offset, drift and bias current, pin leakage, the fixed
/// resistor's tempco, a tolerance), scaling it up leaves the worst reported error no smaller and never turns a FAIL
/// into a PASS. An error counted at its sign could cancel another; the check takes the worse sign where the design
/// gives a bound (INL) and every effect where it enters, so a larger error can only add. The examples run on a coarser
/// grid than their own, both before and after.
/// </summary>
public class MonotonicityProperties
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 2 };

    private static readonly (string Name, Func<FrontEndDesign, double> Get, Func<FrontEndDesign, double, FrontEndDesign> Scale)[] Errors =
    [
        ("adc.offset_error", d => d.Adc.OffsetErrorLsb, (d, k) => d with { Adc = d.Adc with { OffsetErrorLsb = k * d.Adc.OffsetErrorLsb } }),
        ("adc.gain_error", d => d.Adc.GainError, (d, k) => d with { Adc = d.Adc with { GainError = k * d.Adc.GainError } }),
        ("adc.inl", d => d.Adc.InlLsb, (d, k) => d with { Adc = d.Adc with { InlLsb = k * d.Adc.InlLsb } }),
        ("adc.pin_leakage", d => d.Adc.PinLeakageAmperes, (d, k) => d with { Adc = d.Adc with { PinLeakageAmperes = k * d.Adc.PinLeakageAmperes } }),
        ("divider.fixed_tempco", d => d.Divider?.FixedTempcoPerKelvin ?? 0, (d, k) => d with { Divider = d.VoltageDivider with { FixedTempcoPerKelvin = k * d.VoltageDivider.FixedTempcoPerKelvin } }),
        ("divider.fixed_tolerance", d => d.Divider?.FixedTolerance ?? 0, (d, k) => d with { Divider = d.VoltageDivider with { FixedTolerance = Math.Min(0.4, k * d.VoltageDivider.FixedTolerance) } }),
        ("current_source.current_tempco", d => d.CurrentSource?.CurrentTempcoPerKelvin ?? 0,
            (d, k) => d with { CurrentSource = d.CurrentSource! with { CurrentTempcoPerKelvin = k * d.CurrentSource.CurrentTempcoPerKelvin } }),
        ("current_source.reference_resistor_tempco", d => d.CurrentSource?.ReferenceResistorTempcoPerKelvin ?? 0,
            (d, k) => d with { CurrentSource = d.CurrentSource! with { ReferenceResistorTempcoPerKelvin = k * d.CurrentSource.ReferenceResistorTempcoPerKelvin } }),
        ("wiring.current_mismatch", d => d.Wiring?.CurrentMismatch ?? 0,
            (d, k) => d with { Wiring = d.Wiring! with { CurrentMismatch = k * d.Wiring.CurrentMismatch } }),
        ("buffer.offset_voltage", d => d.Buffer?.OffsetVolts ?? 0, (d, k) => d with { Buffer = d.Buffer! with { OffsetVolts = k * d.Buffer.OffsetVolts } }),
        ("buffer.offset_drift", d => d.Buffer?.OffsetDriftVoltsPerKelvin ?? 0, (d, k) => d with { Buffer = d.Buffer! with { OffsetDriftVoltsPerKelvin = k * d.Buffer.OffsetDriftVoltsPerKelvin } }),
        ("buffer.bias_current", d => d.Buffer?.BiasCurrentAmperes ?? 0, (d, k) => d with { Buffer = d.Buffer! with { BiasCurrentAmperes = k * d.Buffer.BiasCurrentAmperes } }),
    ];

    public static TheoryData<string, string> Cases()
    {
        var data = new TheoryData<string, string>();
        foreach (var example in Directory.GetFiles(ExampleDesigns.Folder(), "*.toml").Select(Path.GetFileName).Order(StringComparer.Ordinal))
        {
            var design = ExampleDesigns.Load(example!);
            foreach (var e in Errors.Where(e => e.Get(design) != 0))
                data.Add(example!, e.Name);
        }
        return data;
    }

    [Theory]
    [MemberData(nameof(Cases))]
    public void A_larger_declared_error_never_makes_the_check_more_optimistic(string example, string error)
    {
        var loaded = ExampleDesigns.Load(example);
        var range = loaded.Check.Range;
        var design = loaded with { Check = loaded.Check with { StepKelvin = Math.Max(loaded.Check.StepKelvin, (range.MaxCelsius - range.MinCelsius) / 12) } };
        var scale = Errors.Single(e => e.Name == error).Scale;
        var before = FrontEndCheck.Run(design, Options);
        foreach (var factor in new[] { 2.0, 5.0 })
        {
            var after = FrontEndCheck.Run(scale(design, factor), Options);
            // The check's corners move every bound together (all up, all down). A bound whose first-order effect cancels
            // (a ratiometric current's tempco: I·R_s over I·R_ref) keeps a second-order one of either sign, through a
            // fixed offset read over the reference it scales (1 nA into a delta-sigma input: 3e-5 K for twice the stability chamber's current tempco), so that
            // much may go either way; anything larger is a real loss of pessimism.
            Assert.True(Key(after.Worst.ErrorKelvin) >= Key(before.Worst.ErrorKelvin) - SecondOrderKelvin,
                $"{example}: {error} × {factor} makes the worst error {after.Worst.ErrorKelvin:+0.000000;-0.000000} K from {before.Worst.ErrorKelvin:+0.000000;-0.000000} K");
            Assert.False(!before.Passed && after.Passed, $"{example}: {error} × {factor} turns a FAIL into a PASS");
        }
    }

    /// <summary>What a cancelled bound's second-order effect may take off the worst error (0.2 mK).</summary>
    private const double SecondOrderKelvin = 2e-4;

    private static double Key(double kelvin) => double.IsFinite(kelvin) ? Math.Abs(kelvin) : double.PositiveInfinity;
}

using ThermVerify.Check;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Each closed form a finding prints beside its simulated value agrees with the simulation within the approximation it
/// states, on front ends where that approximation holds: Ohm's law for leakage and the fixed resistor's drift (first
/// order in the tempco), the buffer's offset, drift and bias (less the finite-gain error V/A), the switched-capacitor
/// resistance R_eq = 1/(f_s·C_sh) (Johns &amp; Martin) for the reservoir's recovery, charge sharing from the settled pin
/// for the first conversion (the switch settles within the acquisition, the source does not refill the reservoir during
/// it), the reservoir's sawtooth for the steady sample, and a single pole without a reservoir (exact for C_pin = 0).
/// </summary>
public class ClosedFormAgreementTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 5 };

    [Fact]
    public void First_conversion_from_the_settled_pin_is_the_charge_sharing_step()
    {
        // Fast switch (100 Ω·10 pF = 1 ns ≪ 100 ns) and a slow source refill (5 kΩ·10 nF = 50 µs ≫ 100 ns): within 1 %.
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("filter.reservoir_capacitor", "\"10 nF\""),
            ("adc.sample_rate", "\"20 kHz\""), ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\""));
        foreach (var p in FrontEndCheck.Run(design, Options).Points.Where(p => p.SamplingSimulated))
            Tolerance.AssertClose(p.Simulated.FirstSettlingVolts, p.Estimates.FirstConversionVolts, 0.01, 0, $"first conversion at {p.Celsius} °C");
    }

    [Fact]
    public void Steady_sample_follows_the_reservoirs_sawtooth()
    {
        // The same front end in the steady state: the reservoir loses the shared charge at every sample and recovers
        // through the source over the 50 µs period; within 2 % of the sample's distance from the averaged pin.
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("filter.reservoir_capacitor", "\"10 nF\""),
            ("adc.sample_rate", "\"20 kHz\""), ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\""));
        foreach (var p in FrontEndCheck.Run(design, Options).Points.Where(p => p.SamplingSimulated))
            Tolerance.AssertClose(p.Simulated.SteadySettlingVolts, p.Estimates.SteadySettlingVolts, 0.02, 0, $"steady sample at {p.Celsius} °C");
    }

    [Fact]
    public void Without_a_reservoir_the_first_conversion_leaves_the_single_pole_residual()
    {
        // No pin capacitance: the dominant-pole form is exact; within 1 % of the residual, plus 0.1 µV for the transient's
        // own tolerance where the residual is down to microvolts.
        var design = TestDesign.Make(("adc.precharge", "\"discharged\""), ("adc.acquisition_time", "\"300 ns\""));
        foreach (var p in FrontEndCheck.Run(design, Options).Points.Where(p => p.SamplingSimulated))
            Tolerance.AssertClose(p.Simulated.FirstSettlingVolts, p.Estimates.FirstConversionVolts, 0.01, 1e-7, $"residual at {p.Celsius} °C");
    }

    /// <summary>The DC closed forms on every bundled example: leakage and drift, the buffer, the reservoir's recovery.</summary>
    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Dc_closed_forms_agree_with_the_simulation_on_every_example(string example)
    {
        var design = ExampleDesigns.Load(example);
        var result = FrontEndCheck.Run(design with { Check = design.Check with { StepKelvin = (design.Check.Range.MaxCelsius - design.Check.Range.MinCelsius) / 6 } },
            Options with { MaximumSamplingPoints = 2 });
        var lsb = result.Adc.LsbVolts;
        foreach (var p in result.Points)
        {
            var at = $"{example} at {p.Celsius} °C";
            // Leakage is linear in the circuit; the tempco enters to first order (ΔR/R ≤ 1e-2 here): 1 % + 1 µV. A
            // netlist's diodes are open in its closed form (docs/netlists.md), so their leakage is the simulation's alone.
            if (design.Netlist?.Parsed.Elements.Any(e => e.Kind == 'D') != true)
                Tolerance.AssertClose(p.Simulated.DcLoadingVolts, p.Estimates.LoadingVolts, 0.01, 1e-6, $"DC loading, {at}");
            // The buffer: offset, drift and bias by Ohm's law, less V/A of the finite open-loop gain (A ≥ 100 dB).
            if (design.Buffer is { } b)
                Tolerance.AssertClose(p.Simulated.BufferVolts, p.Estimates.BufferVolts, 0, 1e-6 + 2 * p.IdealVolts / Math.Pow(10, (b.DcGainDecibels ?? 100) / 20), $"buffer, {at}");
            // R_eq is what the DC model of the sampling current is; the closed form takes the step from the unloaded
            // divider rather than the loaded pin: 1 % + 0.01 LSB.
            Tolerance.AssertClose(p.Simulated.AverageSamplingVolts, p.Estimates.AverageSamplingVolts, 0.01, 0.01 * lsb, $"recovery, {at}");
        }
    }
}

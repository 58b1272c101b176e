using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Tests.Ngspice;

namespace ThermVerify.Tests.Check;

/// <summary>
/// Each effect lands in the one column of the error split its finding names, and a finding's size is that column at
/// its worst point. One effect at a time on the plain test front end (10 kΩ NTC and 10 kΩ, 12 bits, 3.3 V), each
/// against its closed form: Ohm's law for leakage, the converter's offset as a code shift (IEEE Std 1241), the op-amp
/// offset drift G·D·(T − 25 °C), the sensor's warming P/δ (IEC 60539-1). The temperature a voltage shift stands for is
/// the Beta model's inverse at the shifted voltage, minus the true temperature.
/// </summary>
public class ErrorSplitTests
{
    private static readonly CheckOptions Options = new() { ComputeRemedies = false, MaximumSamplingPoints = 3 };

    private static double Ohms(double celsius) => 10e3 * Math.Exp(3435 * (1 / (celsius + 273.15) - 1 / 298.15));

    /// <summary>The Beta model's temperature for a low-side divider voltage (Ohm's law and 1/T = 1/T0 + ln(R/R0)/β).</summary>
    private static double Celsius(double volts)
    {
        var ohms = 10e3 * volts / (3.3 - volts);
        return 1 / (1 / 298.15 + Math.Log(ohms / 10e3) / 3435) - 273.15;
    }

    private static double Volts(double celsius) => 3.3 * Ohms(celsius) / (Ohms(celsius) + 10e3);

    // The columns by their finding names, as the severity rule reads them.
    private static Dictionary<string, Func<ErrorContributions, double>> Columns => SeverityRuleTests.Columns;

    /// <summary>
    /// Every column but the finding's own (and quantisation) is zero, to 1e-9 K (the first sample meets the settled pin
    /// to the solver's tolerance), the parts add up, and the finding is that column. What the split computes rather
    /// than simulates is exactly zero where the design lacks it: the converter's part without converter errors, the rest.
    /// </summary>
    private static void OnlyIn(CheckResult result, string findingId, Func<CheckPoint, double> expectedKelvin, double tolerance)
    {
        var only = Columns[findingId];
        foreach (var p in result.Points)
        {
            var c = p.Contributions;
            foreach (var (id, column) in Columns.Where(col => col.Key != findingId))
                Tolerance.AssertClose(0, column(c), 0, 1e-9, $"{id} at {p.Celsius} °C");
            Assert.Equal(0.0, c.RestKelvin);
            if (findingId != "converter") Assert.Equal(0.0, c.ConverterKelvin);
            Tolerance.AssertClose(p.ErrorKelvin, c.Sum, 0, 1e-12, $"parts add up at {p.Celsius} °C");
            Tolerance.AssertClose(expectedKelvin(p), only(c), 0, tolerance, $"{findingId} column at {p.Celsius} °C");
        }
        var finding = Assert.Single(result.Findings, f => f.Id == findingId);
        var worst = result.Points.Single(p => p.Celsius == finding.WorstCelsius);
        Assert.Equal(only(worst.Contributions), finding.SizeKelvin);
    }

    [Fact]
    public void Pin_leakage_is_dc_loading_and_nothing_else()
    {
        // Ohm's law: 2 µA into the pin (written with its sign) pulls it down by I·(R_s ∥ R_f); the board at 25 °C holds
        // the leakage constant.
        var result = FrontEndCheck.Run(TestDesign.Make(("adc.pin_leakage", "\"+2 uA\""), ("check.board_temperature", "\"25 degC\"")), Options);
        OnlyIn(result, "dc-loading",
            p => Celsius(Volts(p.Celsius) - 2e-6 * Ohms(p.Celsius) * 10e3 / (Ohms(p.Celsius) + 10e3)) - p.Celsius, 1e-4);
    }

    [Fact]
    public void Converter_offset_is_the_converter_column()
    {
        // IEEE Std 1241: an offset error of +3 LSB shifts every code by 3; the firmware reads 3·Q more.
        var result = FrontEndCheck.Run(TestDesign.Make(("adc.offset_error", "\"+3 LSB\"")), Options);
        OnlyIn(result, "converter", p => Celsius(Volts(p.Celsius) + 3 * 3.3 / 4096) - p.Celsius, 1e-4);
    }

    [Fact]
    public void Op_amp_drift_is_the_buffer_column_and_the_finding_counts_it()
    {
        // A follower whose offset drifts 200 µV/K with the unit (no board temperature): G·D·(T − 25 °C) at the pin, less
        // the follower's finite-gain error V/A (A = 1e6 here: under 3.3 µV, 0.0001 K).
        var result = FrontEndCheck.Run(Buffer.BufferDesigns.Follower(("buffer.offset_drift", "\"+200 uV/K\"")), Options);
        OnlyIn(result, "buffer-static", p => Celsius(Volts(p.Celsius) + 200e-6 * (p.Celsius - 25)) - p.Celsius, 2e-4);
    }

    [Fact]
    public void A_value_written_without_a_sign_is_a_bound_read_at_the_worse_sign()
    {
        // "3 LSB" is a datasheet bound: at each temperature the check reads the code shifted by +3 or −3, whichever gives
        // the larger |reported − true|, and says which corner it took.
        var result = FrontEndCheck.Run(TestDesign.Make(("adc.offset_error", "\"3 LSB\"")), Options);
        foreach (var p in result.Points)
        {
            double Error(double shiftLsb)
            {
                var code = (int)Math.Floor((Volts(p.Celsius) / (3.3 / 4096)) + shiftLsb + 0.5);
                return Celsius(code * 3.3 / 4096) - p.Celsius;
            }
            var up = Error(3);
            var down = Error(-3);
            Tolerance.AssertClose(Math.Max(Math.Abs(up), Math.Abs(down)), Math.Abs(p.ErrorKelvin), 0, 1e-9, $"worse sign at {p.Celsius} °C");
            Assert.Equal(Math.Abs(up) >= Math.Abs(down) ? "bounds up" : "bounds down", p.Corner);
        }
    }

    [Fact]
    public void Self_heating_is_its_own_column()
    {
        // IEC 60539-1: ΔT = P/δ with P = V_s²/R_s; the warmer sensor reads ΔT high to first order. The second-order term,
        // ½·ΔT·|d ln(dV/dT)/dT|, is under 0.1 % of ΔT for these few millikelvin.
        var result = FrontEndCheck.Run(TestDesign.Make(("sensor.dissipation_constant", "\"20 mW/K\""), ("adc.bits", "16")), Options);
        double Rise(double celsius) => Math.Pow(Volts(celsius), 2) / Ohms(celsius) / 20e-3;
        OnlyIn(result, "self-heating", p => Rise(p.Celsius), 1e-3 * 0.02);
    }

    [Fact]
    public void Reservoir_recovery_is_the_recovery_column_not_dc_loading()
    {
        // A discharged sampling capacitor at 20 kHz drags a 1 µF reservoir fed through 5 kΩ down: the average current of
        // a switched capacitor, R_eq = 1/(f_s·C_sh) (Johns & Martin). No leakage, so DC loading is zero.
        var result = FrontEndCheck.Run(TestDesign.Make(("adc.precharge", "\"discharged\""), ("filter.reservoir_capacitor", "\"1 uF\""),
            ("adc.sample_rate", "\"20 kHz\""), ("adc.acquisition_time", "\"100 ns\""), ("adc.switch_resistance", "\"100 ohm\"")), Options);
        Assert.All(result.Points, p => Assert.Equal(0, p.Contributions.DcLoadingKelvin));
        var recovery = Assert.Single(result.Findings, f => f.Id == "reservoir-recovery");
        var worst = result.Points.Single(p => p.Celsius == recovery.WorstCelsius);
        Assert.Equal(worst.Contributions.RecoveryKelvin, recovery.SizeKelvin);
        var source = Ohms(worst.Celsius) * 10e3 / (Ohms(worst.Celsius) + 10e3);
        Tolerance.AssertClose(-Volts(worst.Celsius) * source / (source + 1 / (20e3 * 10e-12)), worst.Simulated.RecoveryVolts, 0.01, 0, "recovery (V)");
    }

    /// <summary>On every bundled example, each column's finding is that column at the finding's worst point, and the columns add up.</summary>
    [Theory]
    [MemberData(nameof(ExampleDesigns.All), MemberType = typeof(ExampleDesigns))]
    public void Every_finding_of_a_column_is_its_column(string example)
    {
        var design = ExampleDesigns.Load(example);
        var result = FrontEndCheck.Run(design with { Check = design.Check with { StepKelvin = (design.Check.Range.MaxCelsius - design.Check.Range.MinCelsius) / 8 } }, Options);
        foreach (var p in result.Points.Where(p => double.IsFinite(p.ErrorKelvin)))
            Tolerance.AssertClose(p.ErrorKelvin, p.Contributions.Sum, 0, 1e-12, $"{example}: parts add up at {p.Celsius} °C");
        foreach (var f in result.Findings)
        {
            var column = f.Id switch
            {
                "converter" => (Func<ErrorContributions, double>)(c => c.ConverterKelvin),
                "dc-loading" => c => c.DcLoadingKelvin,
                "reservoir-recovery" => c => c.RecoveryKelvin,
                "settling" => c => c.SettlingKelvin,
                "buffer-static" => c => c.BufferKelvin,
                "self-heating" => c => c.SelfHeatingKelvin,
                _ => null,
            };
            if (column is null) continue;
            var worst = result.Points.Single(p => p.Celsius == f.WorstCelsius);
            Assert.Equal(column(worst.Contributions), f.SizeKelvin);
        }
    }
}

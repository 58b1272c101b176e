using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Firmware;

namespace ThermVerify.Tests.Firmware;

/// <summary>
/// The firmware table, its error and the fault thresholds of a netlist front end come from the netlist's ideal
/// transfer (NetlistTransfer) the way a divider's come from the divider formula: the attic fan redrawn as a netlist
/// gives the built-in shape's tables and thresholds, and the kiln vent's fault codes are its network worked by hand.
/// </summary>
public class NetlistFirmwareTests
{
    private static FrontEndDesign Example(string file) => DesignLoader.Load(Path.Combine(Repository.Netlists, file));

    public static TheoryData<string> Requests => new() { "every", "bound", "breakpoints", "corrected" };

    private static TableRequest Request(string kind) => kind switch
    {
        "every" => new TableRequest(),
        "bound" => new TableRequest { BoundKelvin = 0.05 },
        "breakpoints" => new TableRequest { Breakpoints = 12, Scale = FixedPointScale.DeciKelvin },
        _ => new TableRequest { CorrectForLoading = true },
    };

    [Theory]
    [MemberData(nameof(Requests))]
    public void The_attic_fan_as_a_netlist_has_the_built_in_table_and_thresholds(string kind)
    {
        var shape = Verifier.Table(Example("attic-fan-leaky-pin.toml"), Request(kind));
        var netlist = Verifier.Table(Example("attic-fan-leaky-pin-netlist.toml"), Request(kind));
        Assert.Equal(shape.Table.Span, netlist.Table.Span);
        Assert.Equal(shape.Table.Codes, netlist.Table.Codes);
        Assert.Equal(shape.Table.Values, netlist.Table.Values);
        Tolerance.AssertClose(shape.Error.MinErrorKelvin, netlist.Error.MinErrorKelvin, 0, 1e-9, "least table error");
        Tolerance.AssertClose(shape.Error.MaxErrorKelvin, netlist.Error.MaxErrorKelvin, 0, 1e-9, "largest table error");
        Tolerance.AssertClose(shape.Error.HalfCodeKelvin, netlist.Error.HalfCodeKelvin, 0, 1e-9, "half a code");
        var (a, b) = (shape.Faults, netlist.Faults);
        Assert.Equal((a.LowestValidCode, a.HighestValidCode, a.FaultBelowCode, a.FaultAboveCode),
            (b.LowestValidCode, b.HighestValidCode, b.FaultBelowCode, b.FaultAboveCode));
        // The netlist names Rfixed as its fixed resistor: the four faults read the divider's codes.
        Assert.Equal([FaultKind.SensorOpen, FaultKind.SensorShorted, FaultKind.FixedOpen, FaultKind.FixedShorted], b.Faults.Select(f => f.Kind));
        Assert.Equal(a.Faults, b.Faults);
    }

    [Fact]
    public void The_kiln_vents_fault_codes_are_its_network_worked_by_hand()
    {
        // Ohm's law on the kiln vent (textbook circuit analysis, no source needed): the 22 kΩ linearising resistor in
        // parallel with the NTC, 6.8 kΩ from the rail; the RC stages carry no DC current. An open NTC leaves
        // 22k/(22k + 6.8k) of the rail, a shorted one 0 V. Both resistors ±0.1 %; ratiometric, 12 bits, code = round(V/Q).
        const double top = 6.8e3, linear = 22e3, tol = 0.001;
        var design = Example("kiln-vent-two-stage.toml");
        var sensor = design.Sensor.Build();
        double Parallel(double x, double y) => x * y / (x + y);
        var open = new List<int>();
        var valid = new List<int>();
        foreach (var st in new[] { -1, 1 })
            foreach (var sl in new[] { -1, 1 })
            {
                var (rt, rl) = (top * (1 + st * tol), linear * (1 + sl * tol));
                int Code(double fraction) => (int)Math.Round(fraction * 4096, MidpointRounding.AwayFromZero);
                open.Add(Code(rl / (rl + rt)));
                foreach (var c in new[] { 0.0, 100.0 })
                {
                    var lower = Parallel(sensor.ResistanceOhms(c), rl);
                    valid.Add(Code(lower / (lower + rt)));
                }
            }
        var faults = FrontEndCheck.Run(design, new CheckOptions { ComputeRemedies = false }).Faults!;
        Assert.Equal(new FaultCode(FaultKind.SensorOpen, true, open.Min(), open.Max()), faults.For(FaultKind.SensorOpen));
        Assert.Equal(new FaultCode(FaultKind.SensorShorted, false, 0, 0), faults.For(FaultKind.SensorShorted));
        Assert.Equal((valid.Min(), valid.Max()), (faults.LowestValidCode, faults.HighestValidCode));
        // Midway between each fault and the nearest healthy code, the spare code to the healthy side.
        Assert.Equal((valid.Min() + 1) / 2, faults.FaultBelowCode);
        Assert.Equal(valid.Max() + (open.Min() - valid.Max()) / 2, faults.FaultAboveCode);
        Assert.Equal((3127, 3130), (open.Min(), open.Max()));
    }

    [Fact]
    public void A_named_fixed_resistors_faults_are_its_network_worked_by_hand_or_refused_when_they_read_like_a_sensor()
    {
        var kiln = Example("kiln-vent-two-stage.toml");
        var sensorOnly = FrontEndCheck.Run(kiln, new CheckOptions { ComputeRemedies = false }).Faults!;
        // Rtop open: the pin is tied to ground through R_ntc ∥ R_lin, 0 V; shorted: the pin is the rail, full scale.
        var top = FrontEndCheck.Run(kiln with { Netlist = kiln.Netlist! with { FixedElement = "Rtop" } }, new CheckOptions { ComputeRemedies = false }).Faults!;
        Assert.Equal(new FaultCode(FaultKind.FixedOpen, false, 0, 0), top.For(FaultKind.FixedOpen));
        Assert.Equal(new FaultCode(FaultKind.FixedShorted, true, 4095, 4095), top.For(FaultKind.FixedShorted));
        Assert.Equal((sensorOnly.FaultBelowCode, sensorOnly.FaultAboveCode), (top.FaultBelowCode, top.FaultAboveCode));
        // Rlin open leaves a plain divider, which reads like a healthy sensor somewhere in the range: 3.3·R/(R + 6.8k)
        // at 100 °C (R ≈ 987 Ω) is code ≈ 519, inside the healthy 499..2651 (Ohm's law and the β equation by hand).
        var lin = kiln with { Netlist = kiln.Netlist! with { FixedElement = "Rlin" } };
        var e = Assert.Throws<FirmwareInputException>(() => Verifier.Table(lin));
        Assert.Contains("With Rlin open the pin reads codes", e.Message);
        var check = FrontEndCheck.Run(lin, new CheckOptions { ComputeRemedies = false });
        Assert.Null(check.Faults);
        Assert.Equal(e.Message, check.FaultsOmitted);
    }

    [Fact]
    public void A_netlist_header_gives_the_ideal_transfer_the_firmware_inverts()
    {
        var run = Verifier.Table(Example("kiln-vent-two-stage.toml"));
        var header = CHeaderRenderer.Render(run.Header, TestRun.Provenance);
        // By hand: v = E·(R∥R_l)/((R∥R_l) + R_t) = (E/R_t)·R / (R·(R_l + R_t)/(R_t·R_l) + 1), so a = E/R_t, b = 0, c = (R_l + R_t)/(R_t·R_l).
        Assert.Contains(" * Netlist: kiln-vent-two-stage.cir, sensor Rntc, converter at node adc; its ideal transfer", header);
        Assert.Contains(FormattableString.Invariant($"a = {3.3 / 6.8e3:G9}"), header);
        Assert.Contains(FormattableString.Invariant($"c = {28.8e3 / (6.8e3 * 22e3):G9} 1/ohm"), header);
        Assert.Contains("is an open or shorted sensor.", header);
        Assert.DoesNotContain("Divider:", header);
    }

    [Fact]
    public void A_netlist_table_verifies_against_its_design_and_a_wrong_beta_is_named()
    {
        var design = Example("kiln-vent-two-stage.toml");
        var csv = TableCsvRenderer.Render(Verifier.Table(design).Table);
        Assert.True(Verifier.VerifyTable(design, csv, "kiln.csv").Passes);
        var other = design with { Sensor = ((BetaSensorSpec)design.Sensor) with { BetaKelvin = 3950 } };
        var wrong = Verifier.VerifyTable(design, TableCsvRenderer.Render(Verifier.Table(other).Table), "other.csv");
        Assert.False(wrong.Passes);
        var cause = Assert.Single(wrong.LikelyCauses, c => c.Kind == TableCauseKind.WrongBeta);
        Tolerance.AssertClose(3950, cause.FittedValue!.Value, 1e-3);
        Assert.DoesNotContain(wrong.LikelyCauses, c => c.Kind is TableCauseKind.WrongFixedResistor or TableCauseKind.SensorOnOtherSide);
    }
}

using ThermVerify.Design;
using ThermVerify.FrontEnd;

namespace ThermVerify.Tests.FrontEnd;

/// <summary>
/// The closed form of a netlist, found from solves of its ideal form, against the same network worked by hand with
/// Ohm's and Kirchhoff's laws (textbook circuit analysis, no source needed): the kiln vent's divider with a
/// linearising resistor in parallel with the NTC, read through two RC stages that carry no DC current.
/// </summary>
public class NetlistTransferTests
{
    private static readonly NetlistSpec Kiln = DesignLoader.Load(Path.Combine(Repository.Netlists, "kiln-vent-two-stage.toml")).Netlist!;

    private static double Parallel(double a, double b) => a * b / (a + b);

    [Theory]
    [InlineData(300.0)]
    [InlineData(4_000.0)]
    [InlineData(10_000.0)]
    [InlineData(250_000.0)]
    public void The_ideal_transfer_is_the_divider_worked_by_hand(double sensorOhms)
    {
        const double rail = 3.3, top = 6.8e3, linear = 22e3, first = 4.7e3, second = 1e3;
        var lower = Parallel(sensorOhms, linear);
        var transfer = NetlistTransfer.Of(Kiln);
        var volts = rail * lower / (lower + top);
        Tolerance.AssertClose(volts, transfer.OutputVolts(sensorOhms), 1e-12);
        Tolerance.AssertClose(sensorOhms, transfer.SensorOhms(volts), 1e-9);
        Tolerance.AssertClose(first + second + Parallel(top, lower), transfer.TheveninOhms(sensorOhms), 1e-12);
        // dV/dR by the chain rule: dV/dR_lower = rail·top/(lower + top)², dR_lower/dR = (linear/(R + linear))².
        var slope = rail * top / Math.Pow(lower + top, 2) * Math.Pow(linear / (sensorOhms + linear), 2);
        Tolerance.AssertClose(slope, transfer.SlopeVoltsPerOhm(sensorOhms), 1e-9);
    }

    private static readonly NetlistSpec Brine = DesignLoader.Load(Path.Combine(Repository.Netlists, "brine-chiller-bridge-netlist.toml")).Netlist!;

    /// <summary>
    /// A differential input (negative_pin): the transfer is the Wheatstone bridge's output v(outp) − v(outn) worked by
    /// hand (two dividers across one excitation, textbook circuit analysis), its inverse and slope with it, and the
    /// common mode half the sum of the two outputs; the resistance the pin sees is the positive pin's own.
    /// </summary>
    [Theory]
    [InlineData(400.0)]
    [InlineData(1_000.0)]
    [InlineData(1_150.0)]
    public void A_differential_transfer_is_the_bridge_worked_by_hand(double sensorOhms)
    {
        const double rail = 3.3, top = 10e3, high = 10e3, low = 1e3;
        var transfer = NetlistTransfer.Of(Brine);
        var (positive, negative) = (rail * sensorOhms / (sensorOhms + top), rail * low / (high + low));
        Tolerance.AssertClose(positive - negative, transfer.OutputVolts(sensorOhms), 1e-12, 1e-15);
        Tolerance.AssertClose(sensorOhms, transfer.SensorOhms(positive - negative), 1e-9);
        Tolerance.AssertClose(rail * top / Math.Pow(sensorOhms + top, 2), transfer.SlopeVoltsPerOhm(sensorOhms), 1e-9);
        Tolerance.AssertClose((positive + negative) / 2, transfer.CommonModeVolts(sensorOhms), 1e-12);
        Tolerance.AssertClose(Parallel(top, sensorOhms), transfer.TheveninOhms(sensorOhms), 1e-12);
    }

    [Fact]
    public void A_pin_the_sensor_does_not_reach_is_refused_at_the_sensor_card()
    {
        var folder = Directory.CreateTempSubdirectory("tv-netlist-transfer-");
        try
        {
            File.Copy(Path.Combine(Repository.Netlists, "kiln-vent-two-stage.toml"), Path.Combine(folder.FullName, "d.toml"));
            File.WriteAllText(Path.Combine(folder.FullName, "kiln-vent-two-stage.cir"),
                "* the filter fed from the rail, not the sensor\nVrail rail 0 DC 3.3\nRtop rail sense 6.8k\nRntc sense 0 10k\nRlin sense 0 22k\n" +
                "R1 rail f1 4.7k\nC1 f1 0 100n\nR2 f1 adc 1k\nC2 adc 0 1u\n");
            var design = DesignLoader.Load(Path.Combine(folder.FullName, "d.toml"));
            var e = Assert.Throws<DesignException>(() => NetlistTransfer.Of(design.Netlist!));
            Assert.Equal(("kiln-vent-two-stage.cir", 4, 1), (e.SourceName, e.Line, e.Column));
            Assert.Contains("does not change with the sensor Rntc", e.Message);
        }
        finally
        {
            folder.Delete(recursive: true);
        }
    }

    [Fact]
    public void A_voltage_no_sensor_can_give_has_no_resistance()
    {
        var transfer = NetlistTransfer.Of(Kiln);
        Assert.True(double.IsNaN(transfer.SensorOhms(3.3 * Parallel(1e30, 22e3) / (Parallel(1e30, 22e3) + 6.8e3) + 0.01)));
        Assert.True(double.IsNaN(transfer.SensorOhms(-0.1)));
    }
}

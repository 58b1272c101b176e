using System.Runtime.CompilerServices;
using ThermVerify.Design;
using ThermVerify.Simulation;

namespace ThermVerify.FrontEnd;

/// <summary>
/// The closed form of a netlist front end: its ideal transfer, the pin voltage of the netlist with every parasitic and
/// loading removed (<see cref="NetlistCircuit.Ideal"/>: nominal parts, no converter at the pin, no leakage, diodes
/// open) as a function of the sensor's resistance. In a linear circuit a node voltage is bilinear in any one
/// resistance, v(R) = (a·R + b)/(c·R + 1), because the resistance enters the nodal matrix as a rank-one term (the
/// matrix determinant lemma; Cramer's rule gives numerator and determinant both affine in 1/R); the same holds for the
/// resistance the pin sees. Three solves of the ideal netlist give a, b and c exactly, and a fourth checks them, so the
/// closed form, its inverse (what the firmware computes) and its slope are formulas, as the built-in shape's divider
/// formula is. Every effect the check reports is then the difference the converter and the parasitics make.
/// </summary>
internal sealed class NetlistTransfer
{
    private static readonly ConditionalWeakTable<NetlistSpec, NetlistTransfer> Cache = [];

    /// <summary>The test current that measures the resistance the pin sees (its value cancels: the circuit is linear).</summary>
    private const double TestAmperes = 1e-6;

    private readonly Bilinear volts;
    private readonly Bilinear ohms;
    /// <summary>The positive pin alone (the same as <see cref="volts"/> for a single-ended input), for the common mode.</summary>
    private readonly Bilinear pinVolts;

    private readonly NetlistSpec netlist;

    private NetlistTransfer(NetlistSpec netlist)
    {
        this.netlist = netlist;
        var sensor = netlist.SensorElements[0];
        var nominal = netlist.Parsed.Find(sensor)!.Value;
        double[] at = [nominal / 10, nominal, nominal * 10, nominal * 3];
        var open = DcSweep.Element(NetlistCircuit.Ideal(netlist, nominal), sensor, at);
        var probe = NetlistCircuit.Ideal(netlist, nominal)
            .Add(new Circuits.CurrentSource("Iprobe", Circuits.Circuit.Ground, netlist.PinNode, new Circuits.DcWaveform(TestAmperes)));
        var probed = DcSweep.Element(probe, sensor, at);
        var pin = open.Voltage(netlist.PinNode);
        // A differential input converts v(pin) − v(negative_pin): both share the determinant, so the difference is
        // bilinear in R as each node voltage is.
        var v = netlist.NegativePinNode is { } negative
            ? [.. pin.Select((x, i) => x - open.Voltage(negative)[i])]
            : pin;
        var p = probed.Voltage(netlist.PinNode);
        // A pin the sensor does not move (a sensor on another branch, a pin tied to a source) reads no temperature.
        if (!(Math.Abs(v[2] - v[0]) > 1e-9 * Math.Max(v.Max(Math.Abs), 1e-12)))
        {
            var card = netlist.Parsed.Find(sensor)!.At;
            throw new DesignException(card.FileName, card.Line, card.Column, "netlist.sensor",
                $"the voltage at node {netlist.PinNode}{(netlist.NegativePinNode is { } n ? $" against node {n}" : "")} does not change with the sensor {sensor} (in the ideal netlist: nominal parts, no converter, diodes open)",
                "Name the node the sensor's signal reaches as pin, or check the netlist's connections.");
        }
        volts = Bilinear.Through(at, v, "pin voltage");
        pinVolts = netlist.NegativePinNode is null ? volts
            : Math.Abs(pin[2] - pin[0]) > 1e-12 * Math.Max(pin.Max(Math.Abs), 1e-12) ? Bilinear.Through(at, pin, "positive pin's voltage")
            : new Bilinear(0, pin[1], 0);
        ohms = Bilinear.Through(at, [.. p.Select((x, i) => (x - pin[i]) / TestAmperes)], "resistance at the pin");
    }

    public static NetlistTransfer Of(NetlistSpec netlist) => Cache.GetValue(netlist, n => new NetlistTransfer(n));

    /// <summary>v(R) = (a·R + b)/(c·R + 1), the ideal pin voltage for a sensor resistance.</summary>
    public double OutputVolts(double sensorOhms) => volts.At(sensorOhms);

    /// <summary>The inverse, R = (b − v)/(c·v − a); NaN where no positive resistance gives the voltage.</summary>
    public double SensorOhms(double pinVolts)
    {
        var r = volts.Inverse(pinVolts);
        return r > 0 && double.IsFinite(r) ? r : double.NaN;
    }

    /// <summary>
    /// The ideal common mode of a differential input, (v(pin) + v(negative_pin))/2 = v(pin) − v_d/2; the pin's voltage
    /// for a single-ended input.
    /// </summary>
    public double CommonModeVolts(double sensorOhms) =>
        netlist.NegativePinNode is null ? pinVolts.At(sensorOhms) : pinVolts.At(sensorOhms) - volts.At(sensorOhms) / 2;

    /// <summary>dv/dR = (a − b·c)/(c·R + 1)².</summary>
    public double SlopeVoltsPerOhm(double sensorOhms) => volts.Slope(sensorOhms);

    /// <summary>The resistance the pin sees in the ideal netlist with the sensor at <paramref name="sensorOhms"/>.</summary>
    public double TheveninOhms(double sensorOhms) => ohms.At(sensorOhms);

    /// <summary>
    /// What the parts' tempcos ([[netlist.part]]) move the ideal pin voltage by at <paramref name="partsCelsius"/>: the
    /// ideal netlist solved with each such resistor at R·(1 + tc·(T − 25 °C)), against it at nominal values.
    /// </summary>
    public double PartDriftVolts(double sensorOhms, double partsCelsius)
    {
        var drifting = netlist.Parts.Where(p => p.TempcoPerKelvin != 0).ToList();
        if (drifting.Count == 0 || partsCelsius == Circuits.Spice.SpiceDeckWriter.NominalCelsius) return 0;
        var circuit = NetlistCircuit.Ideal(netlist, sensorOhms);
        foreach (var part in drifting)
        {
            var r = (Circuits.Resistor)circuit[part.Name];
            circuit = circuit.Replace(r with { ResistanceOhms = r.ResistanceOhms * (1 + part.TempcoPerKelvin * (partsCelsius - Circuits.Spice.SpiceDeckWriter.NominalCelsius)) });
        }
        var solved = OperatingPoint.Solve(circuit);
        return solved.Voltage(netlist.PinNode) - (netlist.NegativePinNode is { } negative ? solved.Voltage(negative) : 0) - OutputVolts(sensorOhms);
    }

    /// <summary>
    /// What leakage currents out of the pin and out of the negative input's node (a differential input) move the ideal
    /// transfer by: the ideal netlist solved with both currents drawn to ground, against it without them (superposition
    /// in the linear circuit, so each current acts through both pins, the transresistances between them included).
    /// </summary>
    public double LeakageVolts(double sensorOhms, double pinAmperes, double negativeAmperes)
    {
        var circuit = NetlistCircuit.Ideal(netlist, sensorOhms)
            .Add(new Circuits.CurrentSource("Ileak", netlist.PinNode, Circuits.Circuit.Ground, new Circuits.DcWaveform(pinAmperes)));
        if (netlist.NegativePinNode is { } negative)
            circuit = circuit.Add(new Circuits.CurrentSource("Ileakn", negative, Circuits.Circuit.Ground, new Circuits.DcWaveform(negativeAmperes)));
        var solved = OperatingPoint.Solve(circuit);
        return solved.Voltage(netlist.PinNode) - (netlist.NegativePinNode is { } n ? solved.Voltage(n) : 0) - OutputVolts(sensorOhms);
    }

    /// <summary>The coefficients (a, b, c) of the pin voltage, for docs and tests.</summary>
    public (double A, double B, double C) Coefficients => (volts.A, volts.B, volts.C);

    /// <summary>(a·R + b)/(c·R + 1).</summary>
    private readonly record struct Bilinear(double A, double B, double C)
    {
        public double At(double r) => (A * r + B) / (C * r + 1);

        public double Inverse(double v) => (B - v) / (C * v - A);

        public double Slope(double r)
        {
            var d = C * r + 1;
            return (A - B * C) / (d * d);
        }

        /// <summary>
        /// The form through the first three points (a·R − c·R·v + b = v, linear in a, b, c), checked at the fourth: a
        /// miss beyond rounding means the netlist is not linear in the sensor (it cannot be, with diodes open).
        /// </summary>
        public static Bilinear Through(double[] r, double[] v, string what)
        {
            var m = new double[3, 4];
            for (var i = 0; i < 3; i++)
            {
                m[i, 0] = r[i];
                m[i, 1] = 1;
                m[i, 2] = -r[i] * v[i];
                m[i, 3] = v[i];
            }
            var x = Solve(m);
            var form = new Bilinear(x[0], x[1], x[2]);
            var scale = v.Max(Math.Abs);
            if (!(Math.Abs(form.At(r[3]) - v[3]) <= 1e-9 * scale + 1e-15))
                throw new InvalidOperationException($"the ideal netlist's {what} is not bilinear in the sensor's resistance ({form.At(r[3]):G17} against {v[3]:G17})");
            return form;
        }

        /// <summary>Gaussian elimination with partial pivoting on a 3×4 augmented matrix.</summary>
        private static double[] Solve(double[,] m)
        {
            for (var col = 0; col < 3; col++)
            {
                var pivot = col;
                for (var row = col + 1; row < 3; row++)
                    if (Math.Abs(m[row, col]) > Math.Abs(m[pivot, col])) pivot = row;
                for (var k = 0; k < 4; k++) (m[col, k], m[pivot, k]) = (m[pivot, k], m[col, k]);
                for (var row = 0; row < 3; row++)
                {
                    if (row == col || m[col, col] == 0) continue;
                    var f = m[row, col] / m[col, col];
                    for (var k = col; k < 4; k++) m[row, k] -= f * m[col, k];
                }
            }
            return [m[0, 3] / m[0, 0], m[1, 3] / m[1, 1], m[2, 3] / m[2, 2]];
        }
    }
}

using ThermVerify.Circuits;
using ThermVerify.Sensors;

namespace ThermVerify.Tests.Differential;

/// <summary>
/// Seeded random circuits of every element kind the engine has: resistors (some with tempcos), capacitors,
/// inductors, independent voltage and current sources (DC, pulse, PWL), VCVS, VCCS, the op-amp macro-model
/// (follower, non-inverting, inverting or arbitrary pins), diodes, timed switches, sensor resistors (Beta NTC,
/// IEC 60751 RTD) and pin leakage sources. Values are log-uniform over the ranges front ends use. Every node gets a
/// DC path to ground when it is made, voltage-defined branches never close a loop, and the result must pass the
/// engine's own topology check. The same seed always gives the same circuit (System.Random with a seed is
/// deterministic within a .NET version). With <c>currentControlled</c> it adds, after everything else (so that the
/// circuits of every seed without it stay as they were), one to three current-controlled sources (SPICE's F and H)
/// sensing the current of a voltage source of the circuit.
/// </summary>
internal sealed class RandomCircuitGenerator(int seed, CircuitClass circuitClass, int maxNodes = 15, bool currentControlled = false)
{
    private readonly Random random = new(seed);
    private readonly List<Element> elements = [];
    private readonly List<string> nodes = [];
    private readonly Dictionary<string, string> voltageGroups = [];
    private readonly Dictionary<char, int> counters = [];

    private bool Nonlinear => circuitClass == CircuitClass.Nonlinear;

    public static RandomCircuit? Generate(int seed, CircuitClass circuitClass, int maxNodes = 15, bool currentControlled = false)
    {
        for (var attempt = 0; attempt < 20; attempt++)
        {
            var generator = new RandomCircuitGenerator(seed * 97 + attempt, circuitClass, maxNodes, currentControlled);
            if (generator.TryBuild(seed) is { } circuit)
                return circuit;
        }
        return null;
    }

    private RandomCircuit? TryBuild(int seed)
    {
        var count = random.Next(2, maxNodes + 1);
        for (var i = 1; i <= count; i++)
        {
            var node = $"n{i}";
            var parent = random.Next(0, i) is var p && p == 0 ? Circuit.Ground : nodes[p - 1];
            nodes.Add(node);
            AddDcConnection(node, parent);
        }
        if (!elements.Any(e => e is VoltageSource or CurrentSource))
            AddSource(Pick(nodes), Circuit.Ground, preferVoltage: true);
        var extras = random.Next(count / 2, 2 * count + 1);
        for (var k = 0; k < extras; k++)
            AddExtra();
        if (Nonlinear && !elements.Any(e => e is Diode || e is OpAmp { OutputHighVolts: < double.PositiveInfinity }))
        {
            var anode = Pick(nodes);
            AddDiode(anode, RandomNodeOrGround(except: anode));
        }
        if (currentControlled)
            AddCurrentControlled();
        FixSingleConnections();

        var circuit = new Circuit(elements, temperatureCelsius: Math.Round(Uniform(-20, 80)));
        try
        {
            TopologyCheck.Run(circuit);
        }
        catch (TopologyException)
        {
            return null;
        }
        var sources = elements.Where(e => e is VoltageSource or CurrentSource).ToList();
        var sweep = Pick(sources);
        var sweepValue = sweep is VoltageSource v ? ((DcWaveform)v.Waveform).Value : ((DcWaveform)((CurrentSource)sweep).Waveform).Value;
        var span = Math.Max(Math.Abs(sweepValue), sweep is VoltageSource ? 1 : 1e-4);
        var ac = Pick(sources);
        var noiseInput = sources.OfType<VoltageSource>().Select(s => s.Name).FirstOrDefault();
        var withAc = circuit.Replace(ac switch
        {
            VoltageSource s => s with { AcMagnitude = 1 },
            CurrentSource s => s with { AcMagnitude = 1e-3 },
            _ => ac,
        });
        return new RandomCircuit(seed, circuitClass, withAc)
        {
            AcSource = ac.Name,
            NoiseOutput = Pick(nodes),
            NoiseInput = noiseInput,
            SweepSource = sweep.Name,
            SweepFrom = sweepValue - span,
            SweepTo = sweepValue + span,
            TransientStopSeconds = 0,
        };
    }

    /// <summary>An element that conducts at DC between a new node and one already joined to ground.</summary>
    private void AddDcConnection(string node, string parent)
    {
        var roll = random.NextDouble();
        if (roll < 0.45)
            AddResistor(node, parent);
        else if (roll < 0.55)
            AddSensor(node, parent);
        else if (roll < 0.65)
            AddSwitch(node, parent);
        else if (roll < 0.72 && CanTieVoltage(node, parent))
            AddInductor(node, parent);
        else if (roll < 0.82 && CanTieVoltage(node, parent))
            AddSource(node, parent, preferVoltage: true);
        else if (roll < 0.9)
            AddOpAmp(driven: node, input: parent);
        else if (Nonlinear && roll < 0.95)
        {
            AddDiode(node, parent);
            AddResistor(node, parent);
        }
        else
            AddResistor(node, parent);
    }

    private void AddExtra()
    {
        var a = Pick(nodes);
        var b = RandomNodeOrGround(except: a);
        var roll = random.NextDouble();
        if (roll < 0.25) AddResistor(a, b);
        else if (roll < 0.45) AddCapacitor(a, b);
        else if (roll < 0.5 && CanTieVoltage(a, b)) AddInductor(a, b);
        else if (roll < 0.58) AddSource(a, b, preferVoltage: CanTieVoltage(a, b) && random.NextDouble() < 0.5);
        else if (roll < 0.64 && CanTieVoltage(a, b)) AddVcvs(a, b);
        else if (roll < 0.7) AddVccs(a, b);
        else if (roll < 0.76) AddSwitch(a, b);
        else if (roll < 0.8) AddLeakage(a, b);
        else if (roll < 0.84) AddSensor(a, b);
        else if (roll < 0.9) AddOpAmp(driven: null, input: a);
        else if (Nonlinear) AddDiode(a, b);
        else AddCapacitor(a, b);
    }

    private void AddResistor(string a, string b)
    {
        var ohms = LogUniform(10, 1e6);
        elements.Add(random.NextDouble() < 0.2
            ? new Resistor(Name('R'), a, b, ohms, Uniform(-2e-3, 4e-3), Uniform(-1e-5, 1e-5))
            : new Resistor(Name('R'), a, b, ohms));
    }

    private void AddSensor(string a, string b)
    {
        ISensorModel sensor = random.NextDouble() < 0.6
            ? new BetaThermistor(LogUniform(1e3, 100e3), Uniform(3000, 4500))
            : new PlatinumRtd(random.NextDouble() < 0.5 ? 100 : 1000);
        elements.Add(new SensorResistor(Name('T'), a, b, sensor));
    }

    private void AddCapacitor(string a, string b) => elements.Add(new Capacitor(Name('C'), a, b, LogUniform(1e-12, 1e-6)));

    private void AddInductor(string a, string b)
    {
        TieVoltage(a, b);
        elements.Add(new Inductor(Name('L'), a, b, LogUniform(1e-6, 1e-2)));
    }

    private void AddSource(string a, string b, bool preferVoltage)
    {
        if (preferVoltage && CanTieVoltage(a, b))
        {
            TieVoltage(a, b);
            elements.Add(new VoltageSource(Name('V'), a, b, Math.Round(Uniform(-5, 5), 3)));
        }
        else
            elements.Add(new CurrentSource(Name('I'), a, b, Math.Sign(Uniform(-1, 1)) * LogUniform(1e-6, 1e-3)));
    }

    private void AddVcvs(string a, string b)
    {
        TieVoltage(a, b);
        var (cp, cn) = ControlPair();
        elements.Add(new Vcvs(Name('E'), a, b, cp, cn, Math.Sign(Uniform(-1, 1)) * LogUniform(0.1, 10)));
    }

    private void AddVccs(string a, string b)
    {
        var (cp, cn) = ControlPair();
        elements.Add(new Vccs(Name('G'), a, b, cp, cn, Math.Sign(Uniform(-1, 1)) * LogUniform(1e-5, 1e-2)));
    }

    /// <summary>
    /// One to three F or H elements on random nodes, each sensing a voltage source of the circuit (one is added to
    /// ground where there is none); an H is a voltage-defined branch, so it is placed only where it closes no loop of them.
    /// </summary>
    private void AddCurrentControlled()
    {
        if (!elements.OfType<VoltageSource>().Any())
        {
            var node = nodes.FirstOrDefault(n => CanTieVoltage(n, Circuit.Ground));
            if (node is null) return;
            AddSource(node, Circuit.Ground, preferVoltage: true);
        }
        var count = random.Next(1, 4);
        for (var k = 0; k < count; k++)
        {
            var sensed = Pick(elements.OfType<VoltageSource>().Select(v => v.Name).ToList());
            var a = Pick(nodes);
            var b = RandomNodeOrGround(except: a);
            if (random.NextDouble() < 0.5 && CanTieVoltage(a, b))
            {
                TieVoltage(a, b);
                elements.Add(new Ccvs(Name('H'), a, b, sensed, Math.Sign(Uniform(-1, 1)) * LogUniform(10, 1e4)));
            }
            else
                elements.Add(new Cccs(Name('F'), a, b, sensed, Math.Sign(Uniform(-1, 1)) * LogUniform(0.1, 10)));
        }
    }

    private void AddSwitch(string a, string b)
    {
        var closed = random.NextDouble() < 0.5;
        // A placeholder schedule with the state at t = 0; RandomTiming gives the real one once the time scale is known.
        SwitchSchedule schedule = closed ? new IntervalSchedule((0, 1e9)) : new IntervalSchedule((1e9, 2e9));
        elements.Add(new TimedSwitch(Name('S'), a, b, LogUniform(1, 1e3), LogUniform(1e6, 1e12), schedule));
    }

    private void AddLeakage(string a, string b) =>
        elements.Add(new LeakageCurrentSource(Name('B'), a, b, Math.Sign(Uniform(-1, 1)) * LogUniform(1e-10, 1e-7), Uniform(8, 12)));

    private void AddDiode(string a, string b)
    {
        var rs = random.NextDouble() < 0.5 ? 0 : LogUniform(1, 100);
        var (anode, cathode) = random.NextDouble() < 0.5 ? (a, b) : (b, a);
        elements.Add(new Diode(Name('D'), anode, cathode, LogUniform(1e-16, 1e-10), Uniform(1, 2), rs));
    }

    /// <summary>
    /// An op-amp. With a node to drive: a follower, a non-inverting or an inverting stage whose output is that node;
    /// without one, pins on existing nodes (feedback of any sign; unstable ones are screened out later).
    /// </summary>
    private void AddOpAmp(string? driven, string input)
    {
        var name = Name('U');
        var output = driven ?? Pick(nodes);
        string plus, minus;
        var style = driven is null ? 3 : random.Next(0, 3);
        switch (style)
        {
            case 0:
                (plus, minus) = (input, output);
                break;
            case 1:
            {
                var feedback = NewInternalNode();
                (plus, minus) = (input, feedback);
                elements.Add(new Resistor(Name('R'), output, feedback, LogUniform(1e3, 1e5)));
                elements.Add(new Resistor(Name('R'), feedback, Circuit.Ground, LogUniform(1e3, 1e5)));
                break;
            }
            case 2:
            {
                var summing = NewInternalNode();
                (plus, minus) = (Circuit.Ground, summing);
                elements.Add(new Resistor(Name('R'), input, summing, LogUniform(1e3, 1e5)));
                elements.Add(new Resistor(Name('R'), summing, output, LogUniform(1e3, 1e5)));
                break;
            }
            default:
                plus = RandomNodeOrGround();
                minus = RandomNodeOrGround(except: plus);
                break;
        }
        var gbw = LogUniform(1e4, 1e7);
        var amp = new OpAmp(name, plus, minus, output)
        {
            OpenLoopGain = LogUniform(1e3, 1e6),
            GainBandwidthHertz = gbw,
            SecondPoleHertz = random.NextDouble() < 0.5 ? gbw * LogUniform(3, 100) : null,
            OutputResistanceOhms = LogUniform(10, 1e3),
            InputOffsetVolts = Uniform(-5e-3, 5e-3),
            NonInvertingBiasAmperes = Uniform(-1e-8, 1e-8),
            InvertingBiasAmperes = Uniform(-1e-8, 1e-8),
        };
        if (Nonlinear)
        {
            var high = Uniform(1, 12);
            amp = amp with
            {
                OutputHighVolts = high,
                OutputLowVolts = random.NextDouble() < 0.5 ? 0.05 : -Uniform(1, 12),
                SlewRateVoltsPerSecond = random.NextDouble() < 0.5 ? LogUniform(1e5, 1e8) : double.PositiveInfinity,
            };
        }
        elements.Add(amp);
    }

    private string NewInternalNode()
    {
        var node = $"n{nodes.Count + 1}";
        nodes.Add(node);
        return node;
    }

    private (string, string) ControlPair()
    {
        var cp = Pick(nodes);
        return (cp, RandomNodeOrGround(except: cp));
    }

    /// <summary>Every node needs a second connection; a resistor to a random other node gives it one.</summary>
    private void FixSingleConnections()
    {
        foreach (var node in nodes.ToList())
            if (elements.Sum(e => e.Nodes.Count(n => n == node)) < 2)
                AddResistor(node, RandomNodeOrGround(except: node));
    }

    private bool CanTieVoltage(string a, string b) => Group(a) != Group(b);

    private void TieVoltage(string a, string b) => voltageGroups[Group(a)] = Group(b);

    private string Group(string node)
    {
        while (voltageGroups.TryGetValue(node, out var parent))
            node = parent;
        return node;
    }

    private string RandomNodeOrGround(string? except = null)
    {
        while (true)
        {
            var k = random.Next(0, nodes.Count + 1);
            var node = k == nodes.Count ? Circuit.Ground : nodes[k];
            if (node != except)
                return node;
        }
    }

    private string Name(char letter)
    {
        counters[letter] = counters.GetValueOrDefault(letter) + 1;
        return $"{letter}{counters[letter]}";
    }

    private T Pick<T>(IReadOnlyList<T> list) => list[random.Next(list.Count)];

    private double Uniform(double low, double high) => low + (high - low) * random.NextDouble();

    private double LogUniform(double low, double high) => Math.Exp(Uniform(Math.Log(low), Math.Log(high)));
}

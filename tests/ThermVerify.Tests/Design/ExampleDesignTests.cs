using ThermVerify.Design;

namespace ThermVerify.Tests.Design;

public class ExampleDesignTests
{
    private static string NetlistsFolder()
    {
        for (var dir = new DirectoryInfo(AppContext.BaseDirectory); dir is not null; dir = dir.Parent)
        {
            var candidate = Path.Combine(dir.FullName, "netlists");
            if (Directory.Exists(candidate) && File.Exists(Path.Combine(dir.FullName, "Directory.Build.props")))
                return candidate;
        }
        throw new DirectoryNotFoundException("netlists/ not found above the test binaries");
    }

    public static TheoryData<string> Examples()
    {
        var data = new TheoryData<string>();
        foreach (var file in Directory.GetFiles(NetlistsFolder(), "*.toml").Order(StringComparer.Ordinal))
            data.Add(Path.GetFileName(file));
        return data;
    }

    [Fact]
    public void ExampleInTheReferenceDocLoads()
    {
        var doc = File.ReadAllText(Path.Combine(Directory.GetParent(NetlistsFolder())!.FullName, "docs", "design-file.md"));
        var start = doc.IndexOf("```toml\n", StringComparison.Ordinal) + "```toml\n".Length;
        var end = doc.IndexOf("```", start, StringComparison.Ordinal);
        var design = DesignLoader.Parse(doc[start..end], "design-file.md", NetlistsFolder());
        Assert.Equal("bench probe", design.Name);
        Assert.Single(design.Check.Regions);
    }

    [Fact]
    public void ThereAreAtLeastFiveExamples() => Assert.True(Examples().Count >= 5);

    [Theory]
    [MemberData(nameof(Examples))]
    public void ExampleLoadsAndItsNormalFormReloadsEqual(string file)
    {
        var path = Path.Combine(NetlistsFolder(), file);
        var design = DesignLoader.Load(path);
        var normal = DesignWriter.ToToml(design);
        var again = DesignLoader.Parse(normal, file + " (normalised)", NetlistsFolder());
        // Equal in everything but where each came from: the file's bytes, then the normal form's.
        Assert.Equal(design, again with { Source = design.Source });
        Assert.NotEqual(design.Source, again.Source);
        Assert.Equal(normal, DesignWriter.ToToml(again));
    }

    [Fact]
    public void ColdStorageLoggerReadsAsWritten()
    {
        var d = DesignLoader.Load(Path.Combine(NetlistsFolder(), "cold-storage-logger.toml"));
        var beta = Assert.IsType<BetaSensorSpec>(d.Sensor);
        Assert.Equal(100e3, beta.R0Ohms);
        Assert.Equal(4190, beta.BetaKelvin);
        Tolerance.AssertClose(0.01, beta.ResistanceTolerance, 1e-12);
        Tolerance.AssertClose(1.5e-3, beta.DissipationConstantWattsPerKelvin!.Value, 1e-12);
        Tolerance.AssertClose(25e-6, d.VoltageDivider.FixedTempcoPerKelvin, 1e-12);
        Assert.True(d.Adc.IsRatiometric);
        Assert.Equal(PrechargeMode.OtherChannel, d.Adc.Precharge);
        Assert.Equal(0, d.Filter.ReservoirCapacitorFarads);
        Assert.Single(d.Check.Regions);
        Assert.Equal(0.25, d.Check.BudgetAt(-20));
        Assert.Equal(0.5, d.Check.BudgetAt(0));
    }

    [Fact]
    public void ReservoirVariantDiffersOnlyInTheFilterAndName()
    {
        var plain = DesignLoader.Load(Path.Combine(NetlistsFolder(), "cold-storage-logger.toml"));
        var reservoir = DesignLoader.Load(Path.Combine(NetlistsFolder(), "cold-storage-logger-reservoir.toml"));
        Tolerance.AssertClose(100e-9, reservoir.Filter.ReservoirCapacitorFarads, 1e-12);
        Assert.Equal(plain with { Name = reservoir.Name, Description = reservoir.Description, Filter = reservoir.Filter, Source = reservoir.Source }, reservoir);
    }

    [Fact]
    public void BufferedProbeHasItsOpAmp()
    {
        var d = DesignLoader.Load(Path.Combine(NetlistsFolder(), "buffered-cable-probe.toml"));
        var b = Assert.IsType<BufferSpec>(d.Buffer);
        Assert.Equal(BufferTopology.Follower, b.Topology);
        Tolerance.AssertClose(0.5e6, b.SlewRateVoltsPerSecond!.Value, 1e-12);
        Tolerance.AssertClose(30e-9, b.NoiseVoltsPerRootHertz, 1e-12);
        Tolerance.AssertClose(2e-6, b.OffsetDriftVoltsPerKelvin, 1e-12);
        Assert.Equal(new VoltageRange(-0.1, 3.4), b.InputCommonMode);
        Assert.Equal(45, b.MinimumPhaseMarginDegrees);
    }

    [Fact]
    public void OvenUsesIecCoefficientsAndClassB()
    {
        var d = DesignLoader.Load(Path.Combine(NetlistsFolder(), "oven-pt1000.toml"));
        var rtd = Assert.IsType<RtdSensorSpec>(d.Sensor);
        Assert.Equal(1000, rtd.R0Ohms);
        Assert.Equal(RtdClass.B, rtd.ToleranceClass);
        // IEC 60751 coefficients (A, B, C as given in the standard).
        Assert.Equal(3.9083e-3, rtd.A);
        Assert.Equal(-5.775e-7, rtd.B);
        Assert.Equal(-4.183e-12, rtd.C);
        Assert.Equal(4700, d.VoltageDivider.FixedResistorOhms);
    }

    [Fact]
    public void TableExampleCsvFollowsItsStatedBetaModel()
    {
        // Beta model 1/T = 1/T0 + ln(R/R0)/β (see REFERENCES: Beta model) with the parameters the example states.
        var lines = File.ReadAllLines(Path.Combine(NetlistsFolder(), "table-47k-rt.csv")).Skip(1);
        foreach (var line in lines)
        {
            var parts = line.Split(',');
            var celsius = double.Parse(parts[0], System.Globalization.CultureInfo.InvariantCulture);
            var ohms = double.Parse(parts[1], System.Globalization.CultureInfo.InvariantCulture);
            var expected = 47e3 * Math.Exp(3980 * (1 / (celsius + 273.15) - 1 / 298.15));
            Tolerance.AssertClose(expected, ohms, 1e-5, 0, $"{celsius} °C");
        }
    }
}

using ThermVerify.Api;
using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.Files;
using ThermVerify.Limits;
using ThermVerify.Simulation;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// No design ends in exit code 4: what the TOML library, the output writers and the plotting library throw on
/// hostile input is mapped to a documented failure, wrapped failures are unwrapped to their first real cause, and
/// shapes that make the TOML library slow are refused before it sees them.
/// </summary>
public class ExceptionMappingTests
{
    private static DesignException Refused(string text) =>
        Assert.Throws<DesignException>(() => DesignLoader.Parse(text, "x.toml", Path.GetTempPath()));

    [Theory]
    [InlineData("name = \"x\\")]                 // an unterminated string ending in a backslash: the TOML library fails on its own
    [InlineData("name = \"x\\\n")]
    [InlineData("name = '''x")]
    [InlineData("name = \"\"\"x\\")]
    public void Text_the_toml_library_cannot_read_is_a_positioned_design_error(string text)
    {
        var e = Refused(text);
        Assert.StartsWith("TOML syntax", e.Problem);
        Assert.True(e.Line >= 1 && e.Column >= 1);
    }

    [Fact]
    public void A_dotted_key_of_many_parts_is_refused_before_the_toml_library_sees_it()
    {
        // 65,000 segments took the TOML library minutes (super-linear); the bound is checked by a linear scan first.
        var key = string.Join('.', Enumerable.Repeat("a", 65_000));
        var e = Refused($"{key} = 1\n{key} = 2\n");
        Assert.Contains("dotted key with more than 16 parts", e.Problem);
        Assert.Equal((1, 32), (e.Line, e.Column)); // at the 16th dot
    }

    [Fact]
    public void Deep_nesting_is_refused_before_the_toml_library_recurses()
    {
        var e = Refused("a = " + new string('[', 100_000) + new string(']', 100_000) + "\n");
        Assert.Contains("nested more than 32 deep", e.Problem);
    }

    [Fact]
    public void Dots_inside_strings_values_and_comments_are_not_key_parts()
    {
        var text = DesignText.Valid.Replace("name = \"test divider\"", "name = \"a.b.c.d.e.f.g.h.i.j.k.l.m.n.o.p.q.r\" # x.y.z.a.b.c.d.e.f.g.h.i.j.k.l.m.n.o.p");
        Assert.Equal("a.b.c.d.e.f.g.h.i.j.k.l.m.n.o.p.q.r", DesignLoader.Parse(text, "x.toml", Path.GetTempPath()).Name);
    }

    [Fact]
    public void A_wrapped_failure_is_explained_by_its_first_real_cause()
    {
        var simulation = new SimulationException("no convergence");
        var wrapped = new AggregateException(new OperationCanceledException(), new AggregateException(simulation));
        Assert.Same(simulation, Failure.Unwrap(wrapped));
        Assert.Equal(ExitCodes.SimulationFailed, ErrorReport.ExitCodeFor(wrapped));
        Assert.Same(simulation, Failure.Unwrap(new TypeInitializationException("T", simulation)));
        Assert.Equal(ExitCodes.Cancelled, ErrorReport.ExitCodeFor(new AggregateException(new OperationCanceledException())));
    }

    [Fact]
    public void A_time_limit_is_exit_3_with_the_option_named()
    {
        var e = new TimeLimitException(TimeSpan.FromSeconds(2));
        Assert.Equal(ExitCodes.SimulationFailed, ErrorReport.ExitCodeFor(e));
        Assert.Contains("--timeout", e.Message);
    }

    [Fact]
    public void The_plotting_library_refusing_figures_is_exit_3_not_an_internal_error()
    {
        // ScottPlot's autoscaler refuses a span of ±1.7e308 (an "infinite" budget once made it throw during a report).
        var set = new OutputSet(overwrite: false).AddFolder(Path.Combine(Path.GetTempPath(), $"tv-plot-{Guid.NewGuid():N}"), () =>
        {
            var plot = new ScottPlot.Plot();
            plot.Add.ScatterLine(new double[] { 0, 1 }, new double[] { -1.7e308, 1.7e308 });
            return [("p.png", plot.GetImageBytes(400, 300, ScottPlot.ImageFormat.Png))];
        });
        var e = Assert.Throws<OutputRenderException>(() => set.Write());
        Assert.Equal(RenderFailure.Drawing, e.Failure);
        Assert.Equal(ExitCodes.SimulationFailed, ErrorReport.ExitCodeFor(e));
    }

    public static TheoryData<string, string> EdgesOfThePlausibleRanges => new()
    {
        { "gain_bandwidth = \"1 MHz\"", "gain_bandwidth = \"1 Hz\"" },
        { "gain_bandwidth = \"1 MHz\"", "gain_bandwidth = \"100 GHz\"" },
        { "isolation_resistor = \"47 ohm\"", "isolation_resistor = \"1 Tohm\"" },
        { "dc_gain = \"100 dB\"", "dc_gain = \"20 dB\"" },
        { "slew_rate = \"0.5 V/us\"", "slew_rate = \"1 V/s\"" },
        { "budget = \"1 K\"", "budget = \"1000 K\"" },
    };

    /// <summary>Values at the ends of their plausible ranges (which once broke the sweeps, the step and the plot scaling) end in a verdict.</summary>
    [Theory]
    [MemberData(nameof(EdgesOfThePlausibleRanges))]
    public void A_buffered_design_at_the_edge_of_a_plausible_range_ends_in_a_verdict_with_its_report(string line, string replacement)
    {
        using var folder = new HostileFolder();
        var example = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", "buffered-cable-probe.toml"));
        Assert.Contains(line, example);
        var design = folder.Write("edge.toml", example.Replace(line, replacement).Replace("range = \"-20 degC .. 100 degC\"", "range = \"20 degC .. 40 degC\"\nstep = \"10 K\""));
        var run = Cli.CliRunner.Run("check", design, "-q", "--no-remedies", "--sampling-points", "2", "--report", Path.Combine(folder.DesignFolder, "report"),
            "--json", Path.Combine(folder.DesignFolder, "edge.json"), "--junit", Path.Combine(folder.DesignFolder, "edge.xml"));
        Assert.True(run.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed or ExitCodes.SimulationFailed, $"{replacement}: exit {run.ExitCode}: {run.Error}");
    }

    [Fact]
    public void A_report_of_a_slow_sampling_design_draws_its_waveform_inside_the_run()
    {
        // The leaky-pin example at 2 Hz once asked its plot for a sample time just past the end of the run.
        using var folder = new HostileFolder();
        var example = File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "..", "..", "..", "..", "..", "netlists", "attic-fan-leaky-pin.toml"));
        var design = folder.Write("attic.toml", example.Replace("sample_rate = \"10 Hz\"", "sample_rate = \"2 Hz\""));
        var run = Cli.CliRunner.Run("check", design, "-q", "--report", Path.Combine(folder.DesignFolder, "report"));
        Assert.True(run.ExitCode is ExitCodes.Success or ExitCodes.CheckFailed, run.Error);
        Assert.True(File.Exists(Path.Combine(folder.DesignFolder, "report", "plots", "sampling.svg")));
    }

    [Fact]
    public void Every_exception_a_design_can_raise_maps_to_a_documented_code_other_than_4()
    {
        Exception[] designFailures =
        [
            new DesignException("x", 1, 1, "", "p", "h"), new InputFileException("is a FIFO", "h"), new OutputPathException("m"),
            new OutputExistsException("m"), new TimeLimitException(TimeSpan.FromSeconds(1)), new SimulationException("m"),
            new ThermVerify.Ngspice.NgspiceException("m", []), new ThermVerify.Ngspice.NgspiceUnavailableException("m"),
            new OutputRenderException("p", new System.Xml.XmlException("m")),
        ];
        foreach (var e in designFailures)
            Assert.NotEqual(ExitCodes.InternalError, ErrorReport.ExitCodeFor(e));
    }
}

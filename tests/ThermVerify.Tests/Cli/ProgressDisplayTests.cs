using ThermVerify.Cli;
using ThermVerify.Limits;
using ThermVerify.Tolerances;

namespace ThermVerify.Tests.Cli;

public sealed class ProgressDisplayTests
{
    [Fact]
    public void The_bar_shows_the_time_left_at_the_rate_so_far()
    {
        var display = new ProgressDisplay(TextWriter.Null, "units", () => TimeSpan.Zero);
        // 250 of 1,000 units in 10 s: the other 750 take 30 s at that rate.
        var line = display.Line(new RunProgress(250, 1000), TimeSpan.FromSeconds(10));
        Assert.Contains("250/1000 (25 %)", line);
        Assert.Contains("10.0 s, about 30.0 s left", line);
        Assert.Contains("[#######.......................]", line); // 7 of 30 columns
        Assert.Contains("2 min 00 s left", display.Line(new RunProgress(1, 5), TimeSpan.FromSeconds(30)));
        Assert.DoesNotContain("left", display.Line(new RunProgress(1000, 1000), TimeSpan.FromSeconds(40)));
    }

    [Fact]
    public void The_bar_is_redrawn_in_place_only_when_the_percentage_moves_and_ends_with_a_line()
    {
        var terminal = new StringWriter();
        var display = new ProgressDisplay(terminal, "candidates", () => TimeSpan.FromSeconds(1));
        for (var done = 1; done <= 1000; done++) display.Report(new RunProgress(done, 1000));
        display.Report(new RunProgress(500, 1000)); // late report from a worker thread: ignored
        var text = terminal.ToString();
        Assert.Equal(101, text.Count(c => c == '\r')); // 0 % to 100 %
        Assert.EndsWith("1000/1000 (100 %), 1.0 s   " + Environment.NewLine, text);
    }

    [Fact]
    public void No_bar_when_the_output_is_not_the_process_terminal()
    {
        Assert.Null(ProgressDisplay.For(new StringWriter(), "units"));
        Assert.Null(ProgressDisplay.For(Console.Error, "units", quiet: true));
    }
}

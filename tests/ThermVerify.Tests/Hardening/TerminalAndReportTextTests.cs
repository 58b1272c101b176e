using ThermVerify.Cli;
using ThermVerify.Design;
using ThermVerify.Reporting;
using ThermVerify.Tests.Design;

namespace ThermVerify.Tests.Hardening;

/// <summary>
/// Escape codes in a design never reach a terminal raw, and a design's name is plain text in report.md. The escape
/// sequences are ECMA-48's (ESC [ ... m sets colours, ESC ] 0 ; ... BEL sets the window title); common practice, no source.
/// </summary>
public class TerminalAndReportTextTests
{
    [Fact]
    public void An_escape_code_in_a_design_name_is_refused_at_load_with_its_code_point()
    {
        var e = Assert.Throws<DesignException>(() =>
            DesignLoader.Parse(DesignText.With(1, "name = \"probe\\u001b]0;owned\\u0007\""), "x.toml", Path.GetTempPath()));
        Assert.Contains("U+001B", e.Problem);
        Assert.DoesNotContain('\u001b', e.Message);
    }

    [Fact]
    public void A_direction_override_in_a_name_is_refused()
    {
        var e = Assert.Throws<DesignException>(() =>
            DesignLoader.Parse(DesignText.With(1, "name = \"probe\\u202Eevil\""), "x.toml", Path.GetTempPath()));
        Assert.Contains("U+202E", e.Problem);
    }

    [Fact]
    public void Whatever_reaches_the_terminal_shows_control_characters_as_visible_escapes()
    {
        var raw = new StringWriter();
        var terminal = new TerminalText(raw);
        terminal.Write("red \u001b[31mtext\u001b[0m, title \u001b]0;x\u0007, back\rspace\b, bidi \u202Eabc\n");
        terminal.WriteLine("tab\tstays");
        var shown = raw.ToString();
        Assert.DoesNotContain(shown, c => char.IsControl(c) && c is not ('\n' or '\t') || c == '\u202E');
        Assert.Contains("red \\e[31mtext\\e[0m", shown);
        Assert.Contains("\\u0007", shown);
        Assert.Contains("\\r", shown);
        Assert.Contains("\\u202E", shown);
        Assert.Contains("tab\tstays" + Environment.NewLine, shown);
    }

    [Theory]
    [InlineData("probe](javascript:alert(1))", "probe\\]\\(javascript:alert\\(1\\)\\)")]
    [InlineData("<img src=x onerror=alert(1)>", "\\<img src\\=x onerror\\=alert\\(1\\)\\>")]
    [InlineData("**bold** _it_ `code` | cell", "\\*\\*bold\\*\\* \\_it\\_ \\`code\\` \\| cell")]
    [InlineData("# not a heading", "\\# not a heading")]
    public void A_name_in_report_markdown_is_plain_text(string name, string written)
    {
        Assert.Equal(written, ReportMarkdown.UserText(name));
    }
}

using System.CommandLine;
using ThermVerify.Api;
using ThermVerify.Check;
using ThermVerify.Design;
using ThermVerify.Reporting;
using ThermVerify.Reporting.Text;

namespace ThermVerify.Cli;

/// <summary>`thermverify compare A B`: check two designs and put them side by side; exit 0 when both pass, 1 when either fails.</summary>
internal static class CompareCommand
{
    public static Command Create()
    {
        var first = new Argument<FileInfo>("design-a") { Description = "the first design file (TOML), e.g. unbuffered" };
        var second = new Argument<FileInfo>("design-b") { Description = "the second design file (TOML), e.g. buffered or another op-amp" };
        var threads = new Option<int>("--threads") { Description = "simulations in parallel", DefaultValueFactory = _ => Environment.ProcessorCount };
        var noRemedies = new Option<bool>("--no-remedies") { Description = "skip the simulations that search for remedies" };
        var command = new Command("compare", "Check two designs and show them side by side with the same budget table.") { first, second, threads, noRemedies };
        var work = WorkOptions.AddTo(command);
        threads.Validators.Add(r =>
        {
            if (r.GetValueOrDefault<int>() < 1) r.AddError("--threads must be at least 1");
        });
        command.SetAction((parsed, interrupt) => work.Run(parsed, interrupt, cancel =>
        {
            var options = new CheckOptions { Threads = parsed.GetValue(threads), ComputeRemedies = !parsed.GetValue(noRemedies), Cancel = cancel };
            var pair = Verifier.Compare(Verifier.LoadDesign(parsed.GetValue(first)!.FullName), Verifier.LoadDesign(parsed.GetValue(second)!.FullName), options);
            parsed.InvocationConfiguration.Output.Write(ComparisonText.Render(pair.First, pair.Second, pair.FirstProvenance, pair.SecondProvenance));
            return pair.BothPass ? ExitCodes.Success : ExitCodes.CheckFailed;
        }));
        return command;
    }
}

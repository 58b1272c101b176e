using ThermVerify.Provenance;

namespace ThermVerify.Tests;

/// <summary>A provenance for tests that render outputs of results they made themselves (no file, no engine choice).</summary>
internal static class TestRun
{
    public static RunProvenance Provenance { get; } =
        RunProvenance.Of(RunProvenance.BuiltInEngine, null, DesignDigest.OfText("test.toml", "test"), new RunSetting("sampling-points", "25"));
}

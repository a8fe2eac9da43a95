using System.Diagnostics;
using System.Globalization;
using System.Text.Json.Nodes;
using Lightfold.Configuration;
using Lightfold.Randomness;
using Lightfold.Tests.Cli;
using Xunit.Abstractions;

namespace Lightfold.Tests.Hostile;

/// <summary>Seeded-mutation fuzzing of configuration input: every case must end in success or one InputException
/// (exit code 2 through the CLI) — never another exception, a hang or a partial catalog.</summary>
public class ConfigFuzzTests(ITestOutputHelper output)
{
    static readonly string[] Tokens =
    [
        "-1", "0", "1", "1e308", "-1e308", "1e400", "NaN", "Infinity", "-Infinity", "\"abc\"", "\"\"", "true", "false", "null",
        "[]", "{}", "[1,2,3]", "{\"x\":1}", "0.5", "-0.0", "12345678901234567890", "1e-320", "\"1e5\"", "\"NaN\"", "\"g,r\"", "3.7",
    ];

    static string Mutate(string text, ref KeyedRandom rng)
    {
        if (text.Length < 2) return text + Tokens[rng.NextInt(Tokens.Length)];
        var lines = text.Split('\n').ToList();
        int kind = rng.NextInt(8);
        int line = rng.NextInt(lines.Count);
        switch (kind)
        {
            case 0:   // replace a value after a colon
            case 1:
            {
                string l = lines[line];
                int colon = l.IndexOf(':');
                if (colon > 0)
                {
                    int end = l.IndexOfAny([',', '}'], colon);
                    lines[line] = l[..(colon + 1)] + " " + Tokens[rng.NextInt(Tokens.Length)] + (end > 0 ? l[end..] : "");
                }
                break;
            }
            case 2: lines.RemoveAt(line); break;
            case 3: lines.Insert(line, $"\"unknown_key_{rng.NextInt(100)}\": {Tokens[rng.NextInt(Tokens.Length)]},"); break;
            case 4: return text[..rng.NextInt(text.Length)];
            case 5:
            {
                var chars = text.ToCharArray();
                for (int k = 0; k < 3; k++) chars[rng.NextInt(chars.Length)] = "{}[]:,\"x0-.e"[rng.NextInt(12)];
                return new string(chars);
            }
            case 6: lines[line] = lines[line].Replace("true", "false").Replace("0.", "-9."); break;
            default: lines.Insert(line, lines[rng.NextInt(lines.Count)]); break;   // duplicate a line
        }
        return string.Join('\n', lines);
    }

    static IEnumerable<(string Key, JsonNode? Value)> Leaves(JsonNode node, string prefix)
    {
        if (node is JsonObject o)
        {
            foreach (var (k, v) in o)
                foreach (var leaf in v is null ? [(prefix + k, (JsonNode?)null)] : Leaves(v, prefix + k + ".")) yield return leaf;
        }
        else yield return (prefix.TrimEnd('.'), node);
    }

    // 10^4 mutated config files, each loaded (default → file layer): success or InputException only, each within 5 s.
    [Fact]
    public void Mutated_config_files_succeed_or_fail_with_one_clear_message()
    {
        string baseText = ScenarioLoader.DefaultJson();
        string file = Path.Combine(Path.GetTempPath(), $"fuzz-{Guid.NewGuid():N}.json");
        int ok = 0, refused = 0;
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < 10_000; i++)
        {
            var rng = KeyedRandom.For(101, i, Stage.Population);
            string text = baseText;
            int n = 1 + rng.NextInt(3);
            for (int m = 0; m < n; m++) text = Mutate(text, ref rng);
            File.WriteAllText(file, text);
            var start = watch.Elapsed;
            try
            {
                ScenarioLoader.Load([file], [], []);
                ok++;
            }
            catch (InputException e)
            {
                Assert.False(string.IsNullOrWhiteSpace(e.Message));
                Assert.DoesNotContain('\n', e.Message.Trim());
                refused++;
            }
            Assert.True((watch.Elapsed - start).TotalSeconds < 5, $"case {i} took too long");
        }
        output.WriteLine($"config-file fuzz: 10000 cases, {ok} loaded, {refused} refused with one message, {watch.Elapsed.TotalSeconds:F1} s");
        Assert.True(ok > 100 && refused > 1000, "both outcomes are exercised");
    }

    // 10^4 sets of 1–3 random --set overrides over every known key with hostile values.
    [Fact]
    public void Random_set_overrides_succeed_or_fail_with_one_clear_message()
    {
        var keys = Leaves(JsonNode.Parse(ScenarioLoader.Load([], [], []).ResolvedJson)!, "").Select(l => l.Key).ToArray();
        string[] values = ["", "-1", "0", "1", "2.5", "1e9", "-1e9", "NaN", "Infinity", "abc", "true", "false", "0.3,0.1", "g,r,q", "Ia,XX", "1e-300", " ", "💥", "9999999999999999999999"];
        int ok = 0, refused = 0;
        var watch = Stopwatch.StartNew();
        for (int i = 0; i < 10_000; i++)
        {
            var rng = KeyedRandom.For(103, i, Stage.Population);
            var sets = new List<string>();
            int n = 1 + rng.NextInt(3);
            for (int m = 0; m < n; m++)
            {
                string key = rng.NextInt(20) == 0 ? $"nope.k{rng.NextInt(9)}" : keys[rng.NextInt(keys.Length)];
                sets.Add($"{key}={values[rng.NextInt(values.Length)]}");
            }
            try
            {
                ScenarioLoader.Load([], sets, []);
                ok++;
            }
            catch (InputException)
            {
                refused++;
            }
        }
        output.WriteLine($"--set fuzz: 10000 cases over {keys.Length} keys, {ok} loaded, {refused} refused, {watch.Elapsed.TotalSeconds:F1} s");
        Assert.True(ok > 100 && refused > 1000);
    }

    // Through the real CLI (simulate, 3 systems): 24 mutated configs end in exit 0 with a complete catalog, or exit 2
    // with one line on stderr and no part file or shard marker anywhere.
    [Fact]
    public void Mutated_configs_never_leave_a_partial_catalog()
    {
        string baseText = ScenarioLoader.DefaultJson();
        int ok = 0, refused = 0;
        for (int i = 0; i < 24; i++)
        {
            var rng = KeyedRandom.For(107, i, Stage.Population);
            string text = Mutate(baseText, ref rng);
            string file = Path.Combine(Path.GetTempPath(), $"fuzz-{Guid.NewGuid():N}.json"), dir = Path.Combine(Path.GetTempPath(), $"fuzz-out-{Guid.NewGuid():N}");
            File.WriteAllText(file, text);
            var (code, _, err) = CliRunner.Run("simulate", "--config", file, "--out", dir, "--quiet", "--set", "run.count=3", "--set", "microlensing.enabled=false");
            Assert.True(code is 0 or 2, $"case {i}: exit {code}: {err}");
            if (code == 0)
            {
                ok++;
                Assert.True(File.Exists(Path.Combine(dir, "manifest.d", "shard-0000.json")));
            }
            else
            {
                refused++;
                Assert.Single(err.Trim().Split('\n'));
                Assert.False(Directory.Exists(dir) && Directory.GetFiles(dir, "*", SearchOption.AllDirectories).Any(f => f.EndsWith("part.parquet") || f.Contains("manifest.d")), $"case {i} left files");
            }
        }
        output.WriteLine($"CLI config fuzz: 24 cases, {ok} complete catalogs, {refused} refused cleanly");
    }
}

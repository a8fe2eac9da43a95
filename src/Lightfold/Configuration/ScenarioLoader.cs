using System.Text.Json;
using Microsoft.Extensions.Configuration;

namespace Lightfold.Configuration;

/// <summary>Builds a <see cref="Scenario"/> from the configuration layers, later winning.</summary>
/// <remarks>
/// Layers: the embedded default (configs/default.json) → each <c>--config FILE</c> in order →
/// environment variables <c>LIGHTFOLD__SECTION__KEY</c> → each <c>--set section.key=value</c>.
/// Files are JSON; comments and trailing commas are allowed.
/// </remarks>
public static class ScenarioLoader
{
    /// <summary>Prefix of environment variables that set configuration keys.</summary>
    public const string EnvironmentPrefix = "LIGHTFOLD__";

    /// <summary>The embedded default scenario as JSON text.</summary>
    public static string DefaultJson()
    {
        using var stream = typeof(ScenarioLoader).Assembly.GetManifestResourceStream("Lightfold.default.json")
                           ?? throw new InvalidOperationException("embedded default configuration is missing");
        using var reader = new StreamReader(stream);
        return reader.ReadToEnd();
    }

    /// <summary>Loads, binds and validates the layers into one immutable scenario.</summary>
    /// <param name="configFiles">JSON files, applied in order.</param>
    /// <param name="sets">Overrides of the form <c>section.key=value</c>, applied last.</param>
    /// <param name="environment">Environment variables; only those starting with <see cref="EnvironmentPrefix"/> are used.</param>
    /// <exception cref="InputException">Any unreadable file, unknown key or invalid value.</exception>
    public static Scenario Load(IReadOnlyList<string> configFiles, IReadOnlyList<string> sets,
        IEnumerable<KeyValuePair<string, string?>>? environment = null)
    {
        var root = Build(configFiles, sets, environment);
        var reader = new ConfigReader(root);
        var scenario = ScenarioBinder.Bind(reader);
        reader.RejectUnknownKeys();
        return scenario with { ResolvedJson = reader.Resolved.ToJsonString(new JsonSerializerOptions { WriteIndented = true }) };
    }

    /// <summary>The process environment as key/value pairs.</summary>
    public static IEnumerable<KeyValuePair<string, string?>> ProcessEnvironment()
    {
        foreach (System.Collections.DictionaryEntry e in Environment.GetEnvironmentVariables())
            yield return new((string)e.Key, (string?)e.Value);
    }

    static IConfigurationRoot Build(IReadOnlyList<string> configFiles, IReadOnlyList<string> sets,
        IEnumerable<KeyValuePair<string, string?>>? environment)
    {
        var builder = new ConfigurationBuilder();
        builder.AddJsonStream(new MemoryStream(System.Text.Encoding.UTF8.GetBytes(DefaultJson())));
        foreach (string file in configFiles)
        {
            string full = Path.GetFullPath(file);
            if (!File.Exists(full)) throw new InputException($"config file '{file}' does not exist");
            // Parse once ourselves for a message with the line number; the provider re-reads it.
            try
            {
                using var doc = JsonDocument.Parse(File.ReadAllText(full),
                    new JsonDocumentOptions { CommentHandling = JsonCommentHandling.Skip, AllowTrailingCommas = true });
                if (doc.RootElement.ValueKind != JsonValueKind.Object)
                    throw new InputException($"config file '{file}': the top level must be a JSON object");
            }
            catch (JsonException e)
            {
                throw new InputException($"config file '{file}': invalid JSON at line {e.LineNumber + 1}: {InputException.Shown(FirstSentence(e.Message), 200)}");
            }
            catch (IOException e)
            {
                throw new InputException($"config file '{file}' cannot be read: {e.Message}");
            }
            builder.AddJsonStream(new MemoryStream(File.ReadAllBytes(full)));
        }

        var env = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (var (name, value) in environment ?? [])
            if (name.StartsWith(EnvironmentPrefix, StringComparison.OrdinalIgnoreCase) && name.Length > EnvironmentPrefix.Length)
                env[name[EnvironmentPrefix.Length..].Replace("__", ":")] = value;
        builder.AddInMemoryCollection(env);

        var overrides = new Dictionary<string, string?>(StringComparer.OrdinalIgnoreCase);
        foreach (string set in sets)
        {
            int eq = set.IndexOf('=');
            if (eq <= 0 || set[..eq].Trim().Length == 0 || set[..eq].Contains(':'))
                throw new InputException($"--set '{InputException.Shown(set)}': expected section.key=value");
            overrides[set[..eq].Trim().Replace('.', ':')] = set[(eq + 1)..].Trim();
        }
        builder.AddInMemoryCollection(overrides);
        try
        {
            return builder.Build();
        }
        catch (Exception e) when (e is InvalidDataException or FormatException or JsonException)
        {
            throw new InputException($"configuration cannot be read: {InputException.Shown(e.Message, 200)}");
        }
    }

    static string FirstSentence(string message)
    {
        int cut = message.IndexOf(" Path:", StringComparison.Ordinal);
        return cut > 0 ? message[..cut] : message;
    }
}

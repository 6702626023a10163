package org.ringsweep.runner.testing;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Collectors;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.ringsweep.api.circuit.Primitive;
import org.ringsweep.api.model.DriverModel;
import org.ringsweep.api.model.ModelCatalog;
import org.ringsweep.api.model.ModelDescriptor;
import org.ringsweep.api.model.ParameterSpec;
import org.ringsweep.api.model.ReceiverModel;
import org.ringsweep.api.model.RingsweepPlugin;
import org.ringsweep.api.net.Net;
import org.ringsweep.api.net.Stimulus;
import org.ringsweep.api.quantity.Quantities;
import org.ringsweep.generators.deck.DeckOptions;
import org.ringsweep.generators.deck.DeckWriter;
import org.ringsweep.generators.elaborate.Elaboration;
import org.ringsweep.generators.elaborate.Elaborator;
import org.ringsweep.generators.models.BuiltinModels;
import org.ringsweep.runner.input.NetFileLoader;

/**
 * The contract every driver and receiver model must keep, for built-in models and plugins alike.
 * Published in the runner's test-jar ({@code org.ringsweep:ringsweep-runner:test-jar}) for plugin
 * authors: extend it, return your models from {@link #cases()} with the smallest parameters that
 * make each valid, and every test below runs for each.
 *
 * <pre>{@code
 * class AcmeModelContractTests extends ModelContract {
 *     protected List<ModelCase> cases() {
 *         return List.of(new ModelCase(AcmeIoDriverModel.INSTANCE, Map.of("v_high", "VCC")));
 *     }
 * }
 * }</pre>
 *
 * <p>What it checks: the id matches {@link RingsweepPlugin#ID_PATTERN} and the role matches the
 * interface; every parameter has a key, a description, a dimension, and a default that is
 * consistent (none when required; a word among the allowed words; a number that parses with the
 * parameter's unit, or the key of another parameter it defaults to); and a minimal net (3.3 V
 * rail, the model, a 50 Ω 1 ns line, the built-in partner model) loads through the net-file
 * checks, elaborates into valid primitives of which at least one is on the model's pin, renders
 * into an ngspice deck, gives the same circuit twice (stateless) and sane timing numbers.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
public abstract class ModelContract {
    private static final Pattern KEY = Pattern.compile("[a-z][a-z0-9_]*");

    /**
     * One model under test.
     *
     * @param model      the model (a {@link DriverModel} or a {@link ReceiverModel})
     * @param parameters the smallest set of parameters that make it valid, as net-file YAML
     *                   values (e.g. {@code v_high -> VCC}); the net has the rail {@code VCC} = 3.3 V
     */
    public record ModelCase(ModelDescriptor model, Map<String, String> parameters) {
        /** Copies. */
        public ModelCase {
            parameters = Map.copyOf(parameters);
        }

        @Override
        public String toString() {
            return model.role().name().toLowerCase(java.util.Locale.ROOT) + " " + model.id();
        }
    }

    /** The models to check, each with minimal parameters. */
    protected abstract List<ModelCase> cases();

    @TempDir
    Path dir;

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void idIsLowerCaseLettersDigitsAndDashesAndTheRoleMatchesTheInterface(ModelCase c) {
        ModelDescriptor m = c.model();
        assertTrue(RingsweepPlugin.ID_PATTERN.matcher(m.id()).matches(), () -> "id `" + m.id() + "`");
        ModelDescriptor.Role expected = m instanceof DriverModel ? ModelDescriptor.Role.DRIVER : ModelDescriptor.Role.RECEIVER;
        assertTrue(m instanceof DriverModel || m instanceof ReceiverModel, "a model implements DriverModel or ReceiverModel");
        assertEquals(expected, m.role());
        assertFalse(m.description().isBlank(), "a description for ringsweep models");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void everyParameterHasAKeyUnitDescriptionAndAConsistentDefault(ModelCase c) {
        List<ParameterSpec> specs = c.model().parameters();
        Set<String> keys = specs.stream().map(ParameterSpec::key).collect(Collectors.toSet());
        assertEquals(specs.size(), keys.size(), "parameter keys are unique");
        for (ParameterSpec p : specs) {
            String where = c + "/" + p.key();
            assertTrue(KEY.matcher(p.key()).matches(), () -> where + ": key is lower-case letters, digits and _");
            assertFalse(p.description().isBlank(), () -> where + ": description");
            assertTrue(p.dimension() != null && p.type() != null, () -> where + ": type and dimension");
            if (p.required()) {
                assertTrue(p.defaultText().isEmpty(), () -> where + ": a required parameter has no default");
            }
            if (p.type() == ParameterSpec.Type.WORD) {
                assertFalse(p.words().isEmpty(), () -> where + ": a word parameter lists its words");
                assertTrue(p.defaultText().isEmpty() || p.words().contains(p.defaultText()),
                        () -> where + ": default `" + p.defaultText() + "` is one of " + p.words());
            }
            if (p.type() == ParameterSpec.Type.NUMBER && !p.defaultText().isEmpty() && !keys.contains(p.defaultText())) {
                assertDoesNotThrow(() -> Quantities.parse(p.defaultText(), p.dimension()),
                        () -> where + ": default `" + p.defaultText() + "` parses as " + p.dimension());
            }
        }
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void aMinimalNetElaboratesIntoValidPrimitivesOnThePinAndADeck(ModelCase c) {
        Elaborator elaborator = elaboratorWith(c.model());
        Net net = load(c);
        Elaboration first = elaborator.elaborate(net, "contract");
        String pin = c.model().role() == ModelDescriptor.Role.DRIVER ? "U1.1" : "U2.1";
        String pinNode = first.circuit().probes().entrySet().stream().filter(e -> e.getValue().equals(pin))
                .map(Map.Entry::getKey).findFirst().orElseThrow();
        boolean onPin = first.circuit().primitives().stream()
                .filter(p -> !(p instanceof Primitive.LosslessLine) && !(p instanceof Primitive.Inductor))
                .anyMatch(p -> p.nodes().contains(pinNode));
        assertTrue(onPin, () -> c + ": the model adds a primitive on its pin node " + pinNode + ": " + first.circuit().primitives());
        String deck = new DeckWriter().render(first.circuit(), DeckOptions.of("contract.raw"));
        assertTrue(deck.contains(".tran"), "the circuit renders into a deck");
        Elaboration second = elaborator.elaborate(load(c), "contract");
        assertEquals(first.circuit().primitives(), second.circuit().primitives(), "stateless: the same net gives the same circuit");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void timingAndThresholdAnswersAreFiniteAndOrdered(ModelCase c) {
        Net net = load(c);
        org.ringsweep.api.model.NetRails rails = new org.ringsweep.api.model.NetRails(net.rails());
        if (c.model() instanceof DriverModel d) {
            var driver = net.drivers().get(0);
            DriverModel.Swing s = d.swing(driver, rails);
            assertTrue(s.high() > s.low(), "swing high above low");
            for (Stimulus.Edge e : Stimulus.Edge.values()) {
                double t = d.fullTransition(driver, e, rails);
                assertTrue(t > 0 && Double.isFinite(t), () -> "full " + e + " transition " + t + " s");
            }
            double r = d.sourceResistance(driver, rails);
            assertTrue(r > 0 && Double.isFinite(r), () -> "source resistance " + r + " ohm");
            assertTrue(d.delay(driver) >= 0, "delay ≥ 0");
        } else {
            ReceiverModel m = (ReceiverModel) c.model();
            var receiver = net.receivers().get(0);
            ReceiverModel.Thresholds th = m.thresholds(receiver, rails);
            assertTrue(th.vih() > th.vil(), "vih above vil");
            assertTrue(m.inputCapacitance(receiver) >= 0, "input capacitance ≥ 0");
        }
    }

    private static Elaborator elaboratorWith(ModelDescriptor m) {
        List<DriverModel> drivers = new ArrayList<>();
        List<ReceiverModel> receivers = new ArrayList<>();
        if (m instanceof DriverModel d) {
            drivers.add(d);
        } else {
            receivers.add((ReceiverModel) m);
        }
        drivers.addAll(BuiltinModels.drivers());
        receivers.addAll(BuiltinModels.receivers());
        return new Elaborator(drivers, receivers);
    }

    private Net load(ModelCase c) {
        boolean driver = c.model().role() == ModelDescriptor.Role.DRIVER;
        Map<String, String> params = new LinkedHashMap<>(c.parameters());
        String own = params.entrySet().stream().map(e -> ", " + e.getKey() + ": " + e.getValue()).collect(Collectors.joining());
        String yaml = "format: ringsweep/net-1\n"
                + "net: CONTRACT\n"
                + "rails: { VCC: 3.3 }\n"
                + "drivers:\n"
                + (driver ? "  - { pin: U1.1, model: " + c.model().id() + own + " }\n"
                        : "  - { pin: U1.1, model: ramp, v_high: VCC, rise: 1ns, r_out: 25 }\n")
                + "receivers:\n"
                + (driver ? "  - { pin: U2.1, model: cmos, c_in: 2pF, vih: 2.0, vil: 0.8 }\n"
                        : "  - { pin: U2.1, model: " + c.model().id() + own + " }\n")
                + "segments:\n"
                + "  - { from: U1.1, to: U2.1, z0: 50, delay: 1ns }\n";
        Path file = dir.resolve(c.model().id() + ".yaml");
        try {
            Files.writeString(file, yaml, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        List<ModelDescriptor> all = new ArrayList<>(new BuiltinModels().all());
        all.add(c.model());
        ModelCatalog catalog = () -> all;
        return new NetFileLoader(catalog).load(file);
    }
}

-- A sealed (signed-off) work order is evidence: the database itself refuses to change it, its
-- readings or its photos, whatever code or person connects. The API answers 409 before this.
CREATE TRIGGER work_orders_sealed_no_update BEFORE UPDATE ON work_orders FOR EACH ROW
BEGIN
  IF OLD.locked THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER work_orders_sealed_no_delete BEFORE DELETE ON work_orders FOR EACH ROW
BEGIN
  IF OLD.locked THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER readings_sealed_no_insert BEFORE INSERT ON readings FOR EACH ROW
BEGIN
  IF (SELECT locked FROM work_orders WHERE id = NEW.work_order_id) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER readings_sealed_no_update BEFORE UPDATE ON readings FOR EACH ROW
BEGIN
  IF (SELECT locked FROM work_orders WHERE id = OLD.work_order_id) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER readings_sealed_no_delete BEFORE DELETE ON readings FOR EACH ROW
BEGIN
  IF (SELECT locked FROM work_orders WHERE id = OLD.work_order_id) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER photos_sealed_no_insert BEFORE INSERT ON photos FOR EACH ROW
BEGIN
  IF (SELECT locked FROM work_orders WHERE id = NEW.work_order_id) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
--> statement-breakpoint
CREATE TRIGGER photos_sealed_no_delete BEFORE DELETE ON photos FOR EACH ROW
BEGIN
  IF (SELECT locked FROM work_orders WHERE id = OLD.work_order_id) THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'VARDEN_LOCKED: this work order is sealed and cannot change';
  END IF;
END;
